/**
 * Whether a number has at most `places` decimals, to the rounding a double allows
 * (650.1 × 10 is 6501.000000000001). Used where a column keeps a fixed number of
 * decimals: a value with more would be stored as another number, and a small one as 0.
 */
export function hasAtMostDecimals(value: number, places: number): boolean {
  const scaled = value * 10 ** places;
  return Math.abs(scaled - Math.round(scaled)) <= 1e-9 * Math.max(1, Math.abs(scaled));
}
