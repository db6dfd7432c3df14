import { convertTorque, torqueUnitLabels, type TorqueUnit } from '@shared/install-log/torque';
import type { FastenerSpec, TorqueReading } from '@shared/schemas/install-log';
import { parseNumber } from '@shared/numbers';

/** A non-breaking space: "35 lbf·ft" never wraps between the number and its unit. */
const nb = '\u00a0';

/** A value as entered: up to 3 decimals, no trailing zeros. */
export function exact(value: number): string {
  return String(Math.round(value * 1000) / 1000);
}

/** A converted value: 1 decimal from 10 up, 2 below (8.11 lbf·ft, 47.5 N·m). */
export function rounded(value: number): string {
  const digits = Math.abs(value) < 10 ? 2 : 1;
  return String(Math.round(value * 10 ** digits) / 10 ** digits);
}

export function unitLabel(unit: TorqueUnit): string {
  return torqueUnitLabels[unit];
}

/** "35 lbf·ft" as entered. */
export function torque(value: number, unit: TorqueUnit): string {
  return `${exact(value)}${nb}${unitLabel(unit)}`;
}

/** "47.5 N·m" converted. */
export function convertedTorque(value: number, unit: TorqueUnit): string {
  return `${rounded(value)}${nb}${unitLabel(unit)}`;
}

/** "±10 %" or "±2 lbf·ft". */
export function tolerance(spec: FastenerSpec): string {
  return spec.toleranceType === 'percent'
    ? `±${exact(spec.toleranceValue)}${nb}%`
    : `±${torque(spec.toleranceValue, spec.targetUnit)}`;
}

/** "35 lbf·ft ±10 %" — the spec in its own unit. */
export function targetText(spec: FastenerSpec): string {
  return `${torque(spec.targetValue, spec.targetUnit)} ${tolerance(spec)}`;
}

/** "47.5 N·m" — the target in the other unit system. */
export function altTargetText(spec: FastenerSpec): string {
  return convertedTorque(spec.alt.target, spec.alt.unit);
}

/** "31.5–38.5 lbf·ft" */
export function bandText(spec: FastenerSpec): string {
  return `${exact(spec.band.low)}–${exact(spec.band.high)}${nb}${unitLabel(spec.band.unit)}`;
}

/** "42.7–52.2 N·m" */
export function altBandText(spec: FastenerSpec): string {
  return `${rounded(spec.alt.low)}–${rounded(spec.alt.high)}${nb}${unitLabel(spec.alt.unit)}`;
}

/**
 * The other side of a reading: in the spec's unit when it was read in another unit,
 * otherwise in the other unit system ("= 38.4 lbf·ft", "= 51.5 N·m").
 */
export function readingConverted(reading: TorqueReading, spec: FastenerSpec): string {
  if (reading.unit !== spec.targetUnit) {
    return convertedTorque(reading.valueInSpecUnit, spec.targetUnit);
  }
  return convertedTorque(convertTorque(reading.value, reading.unit, spec.alt.unit), spec.alt.unit);
}

/** "4.2 lbf·ft over" / "1.5 lbf·ft under", in the spec's unit. */
export function deviationText(reading: TorqueReading, spec: FastenerSpec): string {
  if (reading.verdict === 'in-spec') return '';
  const amount = convertedTorque(Math.abs(reading.deviation), spec.targetUnit);
  const pct = Math.abs(reading.deviationPercent);
  return `${amount} (${rounded(pct)}${nb}%) ${reading.verdict === 'over' ? 'over' : 'under'} the target`;
}

/**
 * Text from a decimal box, read by the one number reader (shared/numbers: "47,5" and "47.5"
 * are 47.5, "1,250" is 1250); empty is undefined. Kept for the step page's reading entry
 * until it takes NumberInput.
 */
export function parseDecimal(value: unknown): number | undefined {
  return parseNumber(value) ?? undefined;
}

/**
 * When a reading was taken, and when it arrived if it was sent late from the offline queue
 * ("taken 12 Mar, 10:42, arrived 11:15"); a reading that arrived within a minute reads as one time.
 */
export function readingWhen(
  reading: Pick<TorqueReading, 'takenAt' | 'recordedAt'>,
  when: (iso: string) => string,
): string {
  const late = Date.parse(reading.recordedAt) - Date.parse(reading.takenAt) > 60_000;
  return late
    ? `taken ${when(reading.takenAt)}, arrived ${when(reading.recordedAt)}`
    : when(reading.recordedAt);
}
