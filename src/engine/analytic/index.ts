/** The analytic layer: characteristic functions, cumulants, the COS and Lewis pricers, Black-Scholes, implied vols, prices and Greeks, smiles and sensitivities. */
export * from './black';
export * from './characteristic';
export * from './cos';
export * from './cumulants';
export * from './event-move';
export * from './implied-vol';
export * from './lewis';
export * from './normal';
export * from './pricing';
export * from './sensitivity';
export * from './smile';
export * from './strike-grid';
export * from './strip-interpolation';
