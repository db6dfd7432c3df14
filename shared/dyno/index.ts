/**
 * Dyno days (module 7): pure computations shared by the server and the
 * client — weather to dry-air pressure, correction factors with their
 * working, corrected runs and curves, wheel/crank basis, comparisons, and the
 * curve CSV format. Schemas and types are in shared/schemas/dyno.
 */
export * from './apply';
export * from './basis';
export * from './compare';
export * from './correction';
export * from './csv';
export * from './curve';
export * from './vapour-pressure';
export * from './working';
export * from './report';
