/** The paths layer: seeded block random numbers, the QE/Euler/jump step, Monte Carlo blocks and estimates, the Paths page's views and histograms. */
export * from './histogram';
export * from './path-step';
export * from './paths-view';
export * from './random';
export * from './settings-schema';
export * from './simulate';
