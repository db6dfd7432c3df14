/**
 * Bench results (injector flow-bench sheets): pure, shared by the server (the
 * authority) and the client. Schemas and result types are in
 * shared/schemas/bench.
 */
export * from './analyse';
export * from './compare';
export * from './csv';
export * from './imbalance';
export * from './limits';
export * from './points';
export * from './presets';
export * from './statistics';
export * from './units';
export * from './words';
