export * from './disorder.js';
export * from './evaluate.js';
export * from './score.js';
export * from './stats.js';
export * from './uphill.js';
