/** The replay layer: the model's hedge table, hedge replay in blocks, its summaries and saved runs. */
export * from './hedge-table';
export * from './replay-runs';
export * from './replay-summary';
export * from './replay';
export * from './request-schema';
export * from './option-hedge';
export * from './wing-hedge-pilot';
