/**
 * Two sheets of the same injector set compared, e.g. "as received" against
 * "after rebuild": for every point present in both (matched by kind and by
 * label, case and spacing ignored), each injector's change and the change in
 * the set's balance (CV, spread, max deviation).
 */
import {
  normalizeLabel,
  type BenchComparison,
  type BenchStatistics,
  type PointComparison,
} from '@shared/schemas/bench';
import { valuesByPosition, type BenchPointInput } from './analyse';
import { BENCH_MAX_CYLINDERS } from './limits';
import { benchStatistics } from './statistics';
import { convertBenchValue, isFlowUnit, isPressureUnit } from './units';

export type BenchSheetForComparison = {
  /** When both sheets carry a part id they must be the same part. */
  partId?: string;
  points: readonly BenchPointInput[];
};

function pointKey(p: BenchPointInput) {
  return `${p.kind}\u0001${normalizeLabel(p.label)}`;
}

function diff(a: number | null, b: number | null): number | null {
  return a === null || b === null ? null : b - a;
}

function compared(s: BenchStatistics) {
  return {
    n: s.n,
    mean: s.mean,
    cvPct: s.cvPct,
    spreadPct: s.spreadPct,
    maxDeviationPct: s.maxDeviationPct,
  };
}

function whyNotComparable(before: BenchPointInput, after: BenchPointInput): string {
  const flowAndPressure =
    (isFlowUnit(before.unit) && isPressureUnit(after.unit)) ||
    (isPressureUnit(before.unit) && isFlowUnit(after.unit));
  return flowAndPressure
    ? 'One sheet records a flow and the other a pressure'
    : 'ml/min cannot be restated without the stroke rate of both sheets';
}

/**
 * Compares `after` with `before`, position by position at positions
 * 1…cylinders (by default the longest list of values in either). After values
 * recorded in another unit are restated in the before sheet's unit. Changes
 * are after − before; percentages are of the before value; CV, spread and max
 * deviation changes are in percentage points. Throws a RangeError for sheets
 * of two different parts.
 */
export function compareBenchSheets(
  before: BenchSheetForComparison,
  after: BenchSheetForComparison,
  options: { cylinders?: number } = {},
): BenchComparison {
  if (before.partId && after.partId && before.partId !== after.partId) {
    throw new RangeError('Only two sheets of the same part can be compared');
  }
  const cylinders =
    options.cylinders ??
    Math.max(1, ...[...before.points, ...after.points].map((p) => p.values.length));
  if (!Number.isInteger(cylinders) || cylinders < 1 || cylinders > BENCH_MAX_CYLINDERS) {
    throw new RangeError(
      `cylinders must be a whole number from 1 to ${BENCH_MAX_CYLINDERS} (got ${cylinders})`,
    );
  }
  const afterByKey = new Map(after.points.map((p) => [pointKey(p), p] as const));
  const beforeKeys = new Set(before.points.map(pointKey));
  const result: BenchComparison = {
    points: [],
    onlyBefore: [],
    onlyAfter: after.points
      .filter((p) => !beforeKeys.has(pointKey(p)))
      .map((p) => ({ kind: p.kind, label: p.label })),
    notComparable: [],
  };

  for (const b of before.points) {
    const a = afterByKey.get(pointKey(b));
    if (!a) {
      result.onlyBefore.push({ kind: b.kind, label: b.label });
      continue;
    }
    const from = { unit: a.unit, strokesPerMin: a.strokesPerMin ?? null };
    const to = { unit: b.unit, strokesPerMin: b.strokesPerMin ?? null };
    if (convertBenchValue(1, from, to) === null) {
      result.notComparable.push({ kind: b.kind, label: b.label, reason: whyNotComparable(b, a) });
      continue;
    }
    const converted =
      a.unit !== b.unit || (a.unit === 'ml-per-min' && from.strokesPerMin !== to.strokesPerMin);
    const beforeValues = valuesByPosition(b.values, cylinders);
    const afterValues = valuesByPosition(a.values, cylinders).map((v) =>
      v === null ? null : converted ? convertBenchValue(v, from, to) : v,
    );
    const sb = benchStatistics(beforeValues);
    const sa = benchStatistics(afterValues);
    const point: PointComparison = {
      kind: b.kind,
      label: b.label,
      unit: b.unit,
      strokesPerMin: b.strokesPerMin ?? null,
      converted,
      injectors: beforeValues.map((bv, i) => {
        const av = afterValues[i]!;
        const change = diff(bv, av);
        return {
          position: i + 1,
          before: bv,
          after: av,
          change,
          changePct: change === null || bv === 0 ? null : (100 * change) / bv!,
        };
      }),
      before: compared(sb),
      after: compared(sa),
      cvChange: diff(sb.cvPct, sa.cvPct),
      spreadChange: diff(sb.spreadPct, sa.spreadPct),
      maxDeviationChange: diff(sb.maxDeviationPct, sa.maxDeviationPct),
      meanChange: diff(sb.mean, sa.mean),
      meanChangePct:
        sb.mean === null || sa.mean === null || sb.mean === 0
          ? null
          : (100 * (sa.mean - sb.mean)) / sb.mean,
    };
    result.points.push(point);
  }
  return result;
}
