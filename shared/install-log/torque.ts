/**
 * Torque readings judged against a fastener spec. Every conversion goes through
 * shared/units (factors built from NIST SP 811 (2008) B.9 exact definitions:
 * lbf·ft = 1.3558179483314004 N·m, lbf·in = 0.11298482902761668 N·m).
 *
 * Edge rule: a reading exactly on the edge of the tolerance band is in spec.
 * Because a reading taken in another unit comes back through two float
 * multiplications, "exactly on the edge" can land a few ulps outside it
 * (105 lbf·ft → N·m → lbf·ft is not always 105 to the last bit), so the band is
 * widened by EDGE_EPSILON × target on each side before comparing. 1e-9 of the
 * target is far below any wrench's resolution (a 100 lbf·ft target gets
 * 0.0000001 lbf·ft of slack) and far above float error (~1e-16 relative).
 */
import { convertTorque, torqueUnits, type TorqueUnit } from '@shared/units/convert';
import { labelsOf } from '@shared/units/labels';

export { convertTorque, torqueUnits, type TorqueUnit };

export const torqueUnitLabels = labelsOf(torqueUnits);

/** ± an amount in the spec's own unit, or ± a percentage of the target. */
export const toleranceTypes = ['value', 'percent'] as const;
export type ToleranceType = (typeof toleranceTypes)[number];

/** The part of a fastener spec that decides whether a reading is in spec. */
export type TorqueTarget = {
  targetValue: number;
  targetUnit: TorqueUnit;
  toleranceType: ToleranceType;
  toleranceValue: number;
};

/** Relative slack on each edge of the band, as a fraction of the target (see the edge rule above). */
export const EDGE_EPSILON = 1e-9;

export const verdicts = ['in-spec', 'under', 'over'] as const;
export type Verdict = (typeof verdicts)[number];

export const verdictLabels: Record<Verdict, string> = {
  'in-spec': 'In spec',
  under: 'Under spec',
  over: 'Over spec',
};

/** The lowest and highest torque in spec, in the spec's unit. */
export function toleranceBand(spec: TorqueTarget): { low: number; high: number; unit: TorqueUnit } {
  const half =
    spec.toleranceType === 'percent'
      ? (spec.targetValue * spec.toleranceValue) / 100
      : spec.toleranceValue;
  return { low: spec.targetValue - half, high: spec.targetValue + half, unit: spec.targetUnit };
}

export type TorqueJudgement = {
  /** The reading converted to the spec's unit. */
  valueInSpecUnit: number;
  verdict: Verdict;
  /** valueInSpecUnit − target, in the spec's unit (negative when under). */
  deviation: number;
  /** deviation as a percentage of the target. */
  deviationPercent: number;
};

/**
 * Converts a reading to the spec's unit and marks it in spec, under or over.
 * A reading on the edge of the band (within EDGE_EPSILON × target) is in spec.
 */
export function judgeTorque(
  reading: { value: number; unit: TorqueUnit },
  spec: TorqueTarget,
): TorqueJudgement {
  const value = convertTorque(reading.value, reading.unit, spec.targetUnit);
  const { low, high } = toleranceBand(spec);
  const slack = EDGE_EPSILON * Math.abs(spec.targetValue);
  const verdict: Verdict =
    value < low - slack ? 'under' : value > high + slack ? 'over' : 'in-spec';
  const deviation = value - spec.targetValue;
  return {
    valueInSpecUnit: value,
    verdict,
    deviation,
    deviationPercent: (deviation / spec.targetValue) * 100,
  };
}

/**
 * The unit of the other system, for showing a spec "in both unit systems":
 * N·m for lbf·ft and lbf·in specs, lbf·ft for N·m specs.
 */
export function otherSystemUnit(unit: TorqueUnit): TorqueUnit {
  return unit === 'n-m' ? 'lbf-ft' : 'n-m';
}

/** A spec's target and band restated in another unit (no rounding: the page rounds). */
export function restateTarget(spec: TorqueTarget, unit: TorqueUnit) {
  const band = toleranceBand(spec);
  return {
    unit,
    target: convertTorque(spec.targetValue, spec.targetUnit, unit),
    low: convertTorque(band.low, spec.targetUnit, unit),
    high: convertTorque(band.high, spec.targetUnit, unit),
  };
}

/** Rounds for messages and labels: 3 significant decimals at most, no trailing zeros. */
export function formatTorque(value: number, unit: TorqueUnit): string {
  const rounded = Math.round(value * 1000) / 1000;
  return `${rounded} ${torqueUnitLabels[unit]}`;
}

/** "100 lbf·ft ± 5 %" or "60 N·m ± 3 N·m". */
export function describeTarget(spec: TorqueTarget): string {
  const tol =
    spec.toleranceType === 'percent'
      ? `${spec.toleranceValue} %`
      : formatTorque(spec.toleranceValue, spec.targetUnit);
  return `${formatTorque(spec.targetValue, spec.targetUnit)} ± ${tol}`;
}
