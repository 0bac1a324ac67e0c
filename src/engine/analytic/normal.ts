/** The standard normal functions live in the core layer; re-exported here for the analytic layer. */
export * from '../core/normal';
