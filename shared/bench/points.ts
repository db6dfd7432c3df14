/**
 * Kinds of test point on an injector flow-bench sheet, the tolerance each is
 * judged by when the sheet does not say otherwise, and the wording of the
 * rules the page shows beside a verdict.
 *
 * No published standard fixes a general balance tolerance: makers set one per
 * injector model (../shared/reference.md, "Flow-bench statistics"). The
 * defaults below are labelled with their basis: "common practice" where the
 * trade uses a value no publication fixes, "Headroom's choice" where Headroom
 * picked one. Every default is stored with the sheet once chosen, so a sheet
 * keeps the tolerance it was judged against.
 */
import { convertBenchValue, type BenchUnit, type BenchUnitSpec } from './units';

export const testPointKinds = [
  'full-load',
  'part-load',
  'idle',
  'pilot',
  'return-flow',
  'opening-pressure',
  'custom',
] as const;
export type TestPointKind = (typeof testPointKinds)[number];

/** Headroom's words for each kind (the default label of a new point). */
export const testPointKindLabels: Record<TestPointKind, string> = {
  'full-load': 'Full load',
  'part-load': 'Part load',
  idle: 'Idle',
  pilot: 'Pilot',
  'return-flow': 'Return flow',
  'opening-pressure': 'Opening pressure',
  custom: 'Other point',
};

/** Kinds whose values are delivered fuel per stroke. */
export const deliveryKinds: readonly TestPointKind[] = ['full-load', 'part-load', 'idle', 'pilot'];

/** Which units a kind may be recorded in ('custom' may use any bench unit). */
export const unitFamilyOfKind: Record<TestPointKind, 'flow' | 'pressure' | 'any'> = {
  'full-load': 'flow',
  'part-load': 'flow',
  idle: 'flow',
  pilot: 'flow',
  'return-flow': 'flow',
  'opening-pressure': 'pressure',
  custom: 'any',
};

/** ± a percentage of the set mean (or of the nominal), or ± an amount in the point's unit. */
export const toleranceTypes = ['percent', 'absolute'] as const;
export type ToleranceType = (typeof toleranceTypes)[number];

export const toleranceTypeLabels: Record<ToleranceType, string> = {
  percent: '± % of the set mean',
  absolute: '± amount',
};

export type ToleranceDefault = {
  type: ToleranceType;
  value: number;
  /** The unit an absolute default is stated in; null for a percentage. */
  unit: BenchUnit | null;
  /** Where the value comes from. */
  source: string;
};

/**
 * The tolerance each kind of point is judged by unless the sheet sets its own:
 *
 * - full load ±1 % of the set mean: common practice, a matched set is within
 *   about 1 % of the mean at full load (../shared/reference.md);
 * - part load ±1 % of the set mean: the full-load figure applied to part load
 *   (common practice for a matched set; makers often allow more);
 * - idle ±0.5 mm³/stroke and pilot ±0.3 mm³/stroke, absolute because a
 *   percentage of a few mm³ is too tight to read: common practice, no
 *   publication fixes them;
 * - opening pressure ±10 bar: common practice;
 * - return flow ±2 mm³/stroke: Headroom's choice, the least excess over the
 *   others' median the worn rule counts (see {@link WORN_INJECTOR_RULE}), so
 *   that tiny leak-off figures are not called worn on a ratio alone;
 * - other points ±1 % of the set mean: Headroom's choice.
 */
export const defaultTolerances: Record<TestPointKind, ToleranceDefault> = {
  'full-load': {
    type: 'percent',
    value: 1,
    unit: null,
    source: 'common practice: a matched set is within about 1 % of the mean at full load',
  },
  'part-load': {
    type: 'percent',
    value: 1,
    unit: null,
    source: 'common practice for a matched set (the full-load figure; makers often allow more)',
  },
  idle: {
    type: 'absolute',
    value: 0.5,
    unit: 'mm3-per-stroke',
    source: 'common practice (no publication fixes it; makers set a tolerance per injector model)',
  },
  pilot: {
    type: 'absolute',
    value: 0.3,
    unit: 'mm3-per-stroke',
    source: 'common practice (no publication fixes it; makers set a tolerance per injector model)',
  },
  'return-flow': {
    type: 'absolute',
    value: 2,
    unit: 'mm3-per-stroke',
    source:
      "Headroom's choice: the least excess over the others' median that counts as worn, so small leak-off figures are not judged on a ratio alone",
  },
  'opening-pressure': {
    type: 'absolute',
    value: 10,
    unit: 'bar',
    source: 'common practice (makers state the opening pressure and its tolerance per nozzle)',
  },
  custom: {
    type: 'percent',
    value: 1,
    unit: null,
    source: "Headroom's choice",
  },
};

/** The unit each kind is recorded in by default. */
export const defaultUnitOfKind: Record<TestPointKind, BenchUnit> = {
  'full-load': 'mm3-per-stroke',
  'part-load': 'mm3-per-stroke',
  idle: 'mm3-per-stroke',
  pilot: 'mm3-per-stroke',
  'return-flow': 'mm3-per-stroke',
  'opening-pressure': 'bar',
  custom: 'mm3-per-stroke',
};

/**
 * The default tolerance of a kind restated in the unit a point is recorded in
 * (an absolute default of 0.5 mm³/stroke is 0.5 ml/1000 strokes, 10 bar is
 * 1 MPa). Null when it cannot be restated: an absolute flow default for a point
 * in ml/min without its stroke rate, or a flow default for a pressure unit.
 */
export function defaultToleranceFor(
  kind: TestPointKind,
  spec: BenchUnitSpec = { unit: defaultUnitOfKind[kind] },
): { type: ToleranceType; value: number; source: string } | null {
  const d = defaultTolerances[kind];
  if (d.type === 'percent' || d.unit === null) {
    return { type: d.type, value: d.value, source: d.source };
  }
  const value = convertBenchValue(d.value, { unit: d.unit }, spec);
  return value === null ? null : { type: d.type, value, source: d.source };
}

/** The worn-injector rule's ratio: more than 1.5 × the median of the others' return flow. */
export const WORN_RETURN_FLOW_RATIO = 1.5;

/** The worn-injector rule as the page shows it. */
export const WORN_INJECTOR_RULE =
  "An injector is worn when its return flow is more than 1.5 × the median of the other injectors' return flow and more than the point's tolerance above that median, even when its delivery is in tolerance. Common practice: a worn injector returns about twice the others' leak-off.";

/** The maker's return-flow limit rule as the page shows it. */
export const MAKER_RETURN_LIMIT_RULE =
  "When the maker gives a return-flow limit, every injector above it is over the maker's limit. This catches a set that is high all over, which the worn rule cannot see because it compares injectors with each other.";

/** How an edge value is read, as the page shows it. */
export const TOLERANCE_EDGE_RULE = 'A value exactly on the edge of its tolerance is in tolerance.';

/**
 * Slack on each edge of a tolerance band, as a fraction of the band's size
 * (reference value plus half-width). A value entered as exactly the edge can
 * land a few ulps outside after the mean and the percentage are computed in
 * floating point; 1e-9 is far below any bench's resolution and far above
 * float error (~1e-16 relative).
 */
export const BENCH_EDGE_EPSILON = 1e-9;
