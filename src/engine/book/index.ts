/** The book layer: positions and their files, revaluation with the gap ladder, a book under every scenario, the jump odds of each ladder move. */
export * from './book-scenarios';
export * from './book';
export * from './jump-law';
export * from './positions-csv';
export * from './positions';
export * from './schema';
export * from './jump-exposure';
export * from './wing-hedge';
export * from './trade-pnl';
export * from './book-document';
export * from './underlyings';
