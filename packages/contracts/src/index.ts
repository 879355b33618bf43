export * from './errors.js';
export * from './health.js';
export * from './permissions.js';
export * from './auth.js';
export * from './color.js';
export * from './widgets.js';
export * from './usage.js';
export * from './text.js';
