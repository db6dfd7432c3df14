/**
 * Small helpers for the "show the working" of dyno figures, and the unit
 * labels every working and figure uses. Shape as in schemas/dyno.ts
 * (DynoWorking: formula, inputs, constants with sources, steps).
 */
import type {
  DynoFigure,
  DynoStep,
  DynoWorking,
  DynoWorkingInput,
  WorkingConstant,
} from '@shared/schemas/dyno';
import { unitLabels } from '@shared/units/labels';

/** Short labels for every unit id a dyno figure or working can carry. */
export const dynoUnitLabels: Record<string, string> = {
  ...unitLabels,
  '%': '%',
  factor: '×',
  ratio: ':1',
  'mg-per-l-cycle': 'mg/(L·cycle)',
};

/** A number as it reads in a step: six significant digits, trailing zeros dropped, a true minus sign. */
export function fmt(x: number): string {
  if (!Number.isFinite(x)) return String(x);
  const s =
    Math.abs(x) >= 1e6 || (x !== 0 && Math.abs(x) < 1e-4) ? x.toExponential(5) : x.toPrecision(6);
  const trimmed = s.includes('e')
    ? s.replace(/\.?0+e/, 'e')
    : s.includes('.')
      ? s.replace(/\.?0+$/, '')
      : s;
  return trimmed.replace('-', '−');
}

/** A number with its unit label: "97 kPa", "30 °C". */
export function withUnit(x: number, unit: string): string {
  const label = dynoUnitLabels[unit] ?? unit;
  return label === '×' ? `${fmt(x)}` : `${fmt(x)} ${label}`;
}

export function step(label: string, expression: string, value: number, unit: string): DynoStep {
  return { label, expression, value, unit };
}

export function working(
  formula: string,
  inputs: DynoWorkingInput[],
  constants: WorkingConstant[] = [],
  steps: DynoStep[] = [],
): DynoWorking {
  return { formula, inputs, constants, steps };
}

export function dynoFigure(label: string, value: number, unit: string, w: DynoWorking): DynoFigure {
  return { label, value, unit, working: w };
}

/** Throws a RangeError naming the value unless it is a finite number (optionally above zero). */
export function assertFinite(name: string, value: number, opts: { positive?: boolean } = {}) {
  if (!Number.isFinite(value) || (opts.positive && value <= 0)) {
    throw new RangeError(
      `${name} must be a finite number${opts.positive ? ' above zero' : ''} (got ${value})`,
    );
  }
}
