/** Bumped whenever a figure the engine reports could change for the same input and seed. */
export const ENGINE_VERSION = '1.0.0';
