/**
 * Units a flow-bench sheet records its test points in, and conversions between
 * them. Every pressure factor comes from shared/units (bar = 100 kPa exactly,
 * NIST SP 811 (2008) B.8; MPa = 1000 kPa, SI prefixes; psi = 6.894757293168361
 * kPa, NIST SP 811 (2008) B.9); none is repeated here.
 *
 * Delivery is volume per injection ("stroke"):
 * - mm³/stroke, the unit the trade quotes and Headroom's reference;
 * - ml per 1000 strokes: 1 ml = 1 cm³ = 1000 mm³ (SI, NIST SP 811 (2008)
 *   B.8: litre = 1 dm³), so 1 ml/1000 strokes = 1 mm³/stroke exactly;
 * - ml/min at a stated stroke rate: mm³/stroke = ml/min × 1000 ÷ strokes/min.
 *   Without the stroke rate ml/min cannot be turned into a volume per stroke.
 */
import { convertPressure } from '@shared/units/convert';
import { labelsOf } from '@shared/units/labels';

/** Units of delivered (or returned) volume. */
export const benchFlowUnits = ['mm3-per-stroke', 'ml-per-1000-strokes', 'ml-per-min'] as const;
export type BenchFlowUnit = (typeof benchFlowUnits)[number];

/** Units of pressure on the bench (opening pressure, rail or line pressure). */
export const benchPressureUnits = ['bar', 'mpa', 'psi'] as const;
export type BenchPressureUnit = (typeof benchPressureUnits)[number];

/** Every unit a test point can be recorded in. */
export const benchUnits = [...benchFlowUnits, ...benchPressureUnits] as const;
export type BenchUnit = (typeof benchUnits)[number];

export const benchUnitLabels = labelsOf(benchUnits);

export function isFlowUnit(unit: BenchUnit): unit is BenchFlowUnit {
  return (benchFlowUnits as readonly string[]).includes(unit);
}

export function isPressureUnit(unit: BenchUnit): unit is BenchPressureUnit {
  return (benchPressureUnits as readonly string[]).includes(unit);
}

/**
 * mm³ in one ml: 1 ml = 1 cm³ = (10 mm)³ = 1000 mm³ exactly (SI prefixes; the
 * litre is 1 dm³, NIST SP 811 (2008) B.8). Written as the integer because
 * `convertVolume(1, 'ml', 'mm3')` divides two decimal fractions and lands one
 * ulp off 1000.
 */
export const MM3_PER_ML = 1000;

/** A unit as a test point states it: ml/min needs the stroke rate it was measured at. */
export type BenchUnitSpec = { unit: BenchUnit; strokesPerMin?: number | null };

/**
 * A flow in mm³/stroke. ml/1000 strokes is the same number (1 ml = 1000 mm³);
 * ml/min × 1000 ÷ strokes/min. Null when the unit is ml/min and no stroke
 * rate above zero is given (the conversion is then impossible, not zero).
 */
export function toMm3PerStroke(
  value: number,
  unit: BenchFlowUnit,
  strokesPerMin?: number | null,
): number | null {
  if (unit === 'mm3-per-stroke') return value;
  // ml per 1000 strokes × 1000 mm³/ml ÷ 1000 strokes: the same number, kept exact.
  if (unit === 'ml-per-1000-strokes') return value;
  if (strokesPerMin == null || !(strokesPerMin > 0)) return null;
  return (value * MM3_PER_ML) / strokesPerMin;
}

/** The inverse of {@link toMm3PerStroke}; null for ml/min without a stroke rate. */
export function fromMm3PerStroke(
  mm3PerStroke: number,
  unit: BenchFlowUnit,
  strokesPerMin?: number | null,
): number | null {
  if (unit === 'mm3-per-stroke') return mm3PerStroke;
  if (unit === 'ml-per-1000-strokes') return mm3PerStroke;
  if (strokesPerMin == null || !(strokesPerMin > 0)) return null;
  return (mm3PerStroke * strokesPerMin) / MM3_PER_ML;
}

/**
 * Converts a bench value between two point units, e.g. a sheet recorded in
 * ml/min at 1000 strokes/min to another in mm³/stroke. Pressures go through
 * `convertPressure`. Null when the two units measure different things (a flow
 * and a pressure) or when ml/min lacks its stroke rate. ml/min to ml/min at the
 * same (or no) stroke rate is returned unchanged.
 */
export function convertBenchValue(
  value: number,
  from: BenchUnitSpec,
  to: BenchUnitSpec,
): number | null {
  if (isPressureUnit(from.unit) && isPressureUnit(to.unit)) {
    return convertPressure(value, from.unit, to.unit);
  }
  if (isFlowUnit(from.unit) && isFlowUnit(to.unit)) {
    if (
      from.unit === to.unit &&
      (from.unit !== 'ml-per-min' || (from.strokesPerMin ?? null) === (to.strokesPerMin ?? null))
    ) {
      return value;
    }
    const mm3 = toMm3PerStroke(value, from.unit, from.strokesPerMin);
    return mm3 === null ? null : fromMm3PerStroke(mm3, to.unit, to.strokesPerMin);
  }
  return null;
}

/** "mm³/stroke", or "ml/min at 1000 strokes/min". */
export function describeUnit(spec: BenchUnitSpec): string {
  const label = benchUnitLabels[spec.unit];
  return spec.unit === 'ml-per-min' && spec.strokesPerMin
    ? `${label} at ${spec.strokesPerMin} strokes/min`
    : label;
}
