/** Unit conversions built from exact definitions (NIST SP 811 (2008) B.8/B.9). */
export * from './constants';
export * from './convert';
export * from './labels';
export * from './power-torque';
