export * from './core.js';
export * from './signatures.js';
export * from './benches.js';
export * from './evidence.js';
export * from './procedures.js';
export * from './acknowledgements.js';
export * from './authorisations.js';
export * from './practicals.js';
