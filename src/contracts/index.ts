/**
 * The contracts between the browser and the sync service: every REST and sync message as a
 * zod schema or a type, the roles and the error shape. Both sides import this module.
 */
export * from './accounts';
export * from './desks';
export * from './errors';
export * from './roles';
export * from './sets';
export * from './sync';
