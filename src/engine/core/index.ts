/** The engine's core layer: the model registry, schemas and types, stress, market, versions. */
export * from './canonical-json';
export * from './dates';
export * from './fields';
export * from './labels';
export * from './market';
export * from './model-registry';
export * from './model-spec';
export * from './models';
export * from './parameters';
export * from './scenario-defaults';
export * from './scheduled-moves';
export * from './schema';
export * from './stress';
export * from './types';
export * from './validate';
export * from './version';
