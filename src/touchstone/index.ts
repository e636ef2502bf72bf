export * from './diagnostics.js';
export * from './types.js';
export { parseTouchstone, portsFromFileName, TouchstoneParser, type ParseOptions, type ParseResult } from './parse.js';
export { toNetwork, toRealImagInPlace, type NoiseParameters, type TouchstoneData, type TouchstoneInfo } from './normalize.js';
export { readTouchstone, fromParsed, type ReadResult } from './read.js';
export { writeTouchstone, shiftDecimal, TouchstoneWriteError, type WriteOptions } from './write.js';
