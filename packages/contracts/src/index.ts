export * from './errors.js';
export * from './health.js';
export * from './permissions.js';
export * from './auth.js';
