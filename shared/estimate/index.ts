/** The power estimator: pure, shared by the server (the authority) and the client (what-if). */
export * from './assumptions';
export * from './chains';
export * from './estimate';
