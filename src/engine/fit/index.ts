/** The fit layer: calibration (Levenberg-Marquardt over bounded parameters), quote files, the jumps verdict and the solve to target vols. */
export * from './calibrate';
export * from './calibration-space';
export * from './event-sizes';
export * from './jumps-verdict';
export * from './levenberg-marquardt';
export * from './quotes-csv';
export * from './solve-to-targets';
export * from './demo-chain';
export * from './parameter-errors';
export * from './forwards';
export * from './arbitrage';
export * from './chain-quotes';
export * from './fit-history';
