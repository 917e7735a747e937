export * from './core.js';
export * from './signatures.js';
