/**
 * Bounds of a bench sheet, shared by the schemas and the parsers so a CSV is
 * held to the same limits as a form. Headroom's choices, not trade figures.
 */

/** Injector positions: one per cylinder, and a build has at most 16 (as the build schema). */
export const BENCH_MAX_CYLINDERS = 16;

/** Test points on one sheet. */
export const BENCH_MAX_POINTS = 30;

/** Largest value, nominal, limit or tolerance accepted (3000 bar is about 43 500 psi). */
export const BENCH_MAX_VALUE = 1_000_000;

/**
 * Test-fluid temperatures accepted, in °C. ISO 4008 benches run calibration
 * fluid at about 40 °C; the range only stops typing slips (°F typed as °C).
 */
export const benchFluidTemperatureRangeC = { min: -20, max: 150 } as const;
