// The phase-control engine: pure functions, shared by the server (authority) and the client (previews).
export * from './errors';
export * from './numeric';
export * from './resistive';
export * from './inverse';
export * from './inductive';
export * from './load-model';
export * from './trigger';
export * from './simulate';
export * from './waveform';
export * from './thermal';
export * from './ratings';
export * from './limits';
export * from './earth-continuity';
export * from './calculators';
