/**
 * Statistics of one test point across an injector set, with the formulas of
 * ../shared/reference.md ("Flow-bench statistics"):
 *
 *   mean x̄ = Σx / n; population SD = √(Σ(x − x̄)² / n); sample SD = √(Σ(x − x̄)² / (n − 1));
 *   CV = s / x̄ (s the sample SD); deviation of injector i % = 100·(xᵢ − x̄)/x̄;
 *   max deviation % = 100·max|xᵢ − x̄| / x̄; spread % = 100·(max − min) / x̄.
 *
 * A missing value (null) is never a zero: every figure is over the values
 * present, and `n` / `missing` say how many there were.
 *
 * The sum of squares is computed with the corrected two-pass algorithm
 * (Chan, Golub & LeVeque, "Algorithms for computing the sample variance",
 * The American Statistician 37 (1983)): deviations from the first-pass mean,
 * less the square of their sum over n, which cancels the first pass's rounding.
 * The one-pass Σx² − (Σx)²/n subtracts two nearly equal large numbers and
 * loses every digit once the values are large against their spread (NIST StRD
 * NumAcc1, 10000001, 10000003, 10000002, must give a sample SD of exactly 1;
 * the same set shifted to 1e12 gives NaN one-pass).
 */
import type { BenchStatistics } from '@shared/schemas/bench';

export type { BenchStatistics };

function present(values: readonly (number | null)[]): number[] {
  const out: number[] = [];
  for (const v of values) {
    if (v === null) continue;
    if (!Number.isFinite(v)) throw new RangeError(`Bench values must be finite numbers (got ${v})`);
    out.push(v);
  }
  return out;
}

/** Mean and sum of squared deviations by the corrected two-pass algorithm. */
function meanAndSumOfSquares(xs: readonly number[]): { mean: number; ss: number } {
  const n = xs.length;
  let sum = 0;
  for (const x of xs) sum += x;
  const first = sum / n;
  let c = 0;
  let ss = 0;
  for (const x of xs) {
    const d = x - first;
    c += d;
    ss += d * d;
  }
  return { mean: first + c / n, ss: Math.max(0, ss - (c * c) / n) };
}

/** Percentage of the mean, or null when the mean is zero. */
function pctOf(x: number, mean: number): number | null {
  return mean === 0 ? null : (100 * x) / mean;
}

/**
 * The statistics of one point's values (one per injector position, null where
 * none was recorded). Throws a RangeError on a non-finite value: validate with
 * the bench schemas first.
 */
export function benchStatistics(values: readonly (number | null)[]): BenchStatistics {
  const xs = present(values);
  const n = xs.length;
  const missing = values.length - n;
  if (n === 0) {
    return {
      n,
      missing,
      mean: null,
      sampleSd: null,
      populationSd: null,
      cvPct: null,
      min: null,
      max: null,
      maxDeviationPct: null,
      spreadPct: null,
    };
  }
  const { mean, ss } = meanAndSumOfSquares(xs);
  const min = Math.min(...xs);
  const max = Math.max(...xs);
  const sampleSd = n > 1 ? Math.sqrt(ss / (n - 1)) : null;
  let maxAbsDeviation = 0;
  for (const x of xs) maxAbsDeviation = Math.max(maxAbsDeviation, Math.abs(x - mean));
  return {
    n,
    missing,
    mean,
    sampleSd,
    populationSd: Math.sqrt(ss / n),
    cvPct: sampleSd === null ? null : pctOf(sampleSd, mean),
    min,
    max,
    maxDeviationPct: pctOf(maxAbsDeviation, mean),
    spreadPct: pctOf(max - min, mean),
  };
}

/** Each value's deviation from the mean in % (null where the value or the percentage is missing). */
export function deviationsPct(
  values: readonly (number | null)[],
  mean: number | null,
): (number | null)[] {
  return values.map((v) => (v === null || mean === null ? null : pctOf(v - mean, mean)));
}

/** The median of the values given (middle one, or the mean of the middle two); null when empty. */
export function median(values: readonly number[]): number | null {
  if (values.length === 0) return null;
  const sorted = [...values].sort((a, b) => a - b);
  const mid = sorted.length >> 1;
  return sorted.length % 2 ? sorted[mid]! : (sorted[mid - 1]! + sorted[mid]!) / 2;
}
