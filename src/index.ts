export * from './errors.js';
export * from './physics/index.js';
export * from './search/index.js';
export * from './metrics/index.js';
