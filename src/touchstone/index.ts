export * from './diagnostics.js';
export * from './types.js';
export type { TouchstoneData } from './normalize.js';
export { readTouchstone } from './read.js';
export { writeTouchstone, type WriteOptions } from './write.js';
