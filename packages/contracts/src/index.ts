export * from './errors.js';
export * from './health.js';
