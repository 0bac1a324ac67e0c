/** Bumped whenever a change can alter any computed number; cached results carry it. */
export const ENGINE_VERSION = '0.7.0';
