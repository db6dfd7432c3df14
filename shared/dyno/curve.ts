/**
 * A run's curve: rows of rpm with power and/or torque. The missing one of the
 * two comes from the definition of power, P = 2πnT/60 (n in rev/min): in the
 * trade's units hp = T[lbf·ft] × rpm / 5252.1131220 (33000/2π), in SI
 * kW = T[N·m] × rpm / 9549.2965855 (60000/2π) — shared/units/power-torque.
 */
import { powerFromTorque, torqueFromPower } from '@shared/units/power-torque';
import type {
  CompletedCurveRow,
  CurveRow,
  DynoPowerUnit,
  DynoTorqueUnit,
  RunPeaks,
} from '@shared/schemas/dyno';

/** True when every row's rpm is at least the one before it. */
export function isSortedByRpm(rows: readonly { rpm: number }[]): boolean {
  for (let i = 1; i < rows.length; i++) if (rows[i].rpm < rows[i - 1].rpm) return false;
  return true;
}

/** The rows by rising rpm; rows at the same rpm keep their order (a stable sort). A new array. */
export function sortCurve<T extends { rpm: number }>(rows: readonly T[]): T[] {
  return rows
    .map((row, i) => ({ row, i }))
    .sort((a, b) => a.row.rpm - b.row.rpm || a.i - b.i)
    .map(({ row }) => row);
}

/**
 * The curve sorted by rpm with both power and torque on every row: the one a
 * row lacks is computed from the other by P = 2πnT/60 in the run's units,
 * and `computed` names it. Rows with neither are left out (the schema refuses
 * them).
 */
export function completeCurve(
  rows: readonly CurveRow[],
  powerUnit: DynoPowerUnit,
  torqueUnit: DynoTorqueUnit,
): CompletedCurveRow[] {
  const out: CompletedCurveRow[] = [];
  for (const r of sortCurve(rows)) {
    const base = {
      rpm: r.rpm,
      boost: r.boost ?? null,
      egt: r.egt ?? null,
      mixture: r.mixture ?? null,
    };
    if (r.power != null && r.torque != null) {
      out.push({ ...base, power: r.power, torque: r.torque, computed: null });
    } else if (r.torque != null) {
      const power = powerFromTorque(r.torque, torqueUnit, r.rpm, powerUnit);
      out.push({ ...base, power, torque: r.torque, computed: 'power' });
    } else if (r.power != null) {
      const torque = torqueFromPower(r.power, powerUnit, r.rpm, torqueUnit);
      out.push({ ...base, power: r.power, torque, computed: 'torque' });
    }
  }
  return out;
}

/**
 * Peak power and peak torque of a curve with the rpm of each (the lowest rpm
 * on a tie), after filling in power or torque from the other. The sources are
 * 'none' and all null for an empty curve.
 */
export function curvePeaks(
  rows: readonly CurveRow[],
  powerUnit: DynoPowerUnit,
  torqueUnit: DynoTorqueUnit,
): RunPeaks {
  const full = completeCurve(rows, powerUnit, torqueUnit);
  if (full.length === 0) {
    return {
      power: null,
      powerRpm: null,
      torque: null,
      torqueRpm: null,
      powerSource: 'none',
      torqueSource: 'none',
    };
  }
  let p = full[0];
  let t = full[0];
  for (const r of full) {
    if (r.power > p.power) p = r;
    if (r.torque > t.torque) t = r;
  }
  return {
    power: p.power,
    powerRpm: p.rpm,
    torque: t.torque,
    torqueRpm: t.rpm,
    powerSource: 'curve',
    torqueSource: 'curve',
  };
}
