export * from './design-space.js';
export * from './feasibility.js';
export * from './geometry.js';
