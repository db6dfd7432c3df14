/**
 * Bench numbers for reading on screen: the same rounding as the verdict's words
 * (shared/bench/words), so a table and the sentence under it never disagree.
 * The API keeps full precision; only the page rounds.
 */
import {
  benchUnitLabels,
  pctWords,
  ratioWords,
  roundForWords,
  signedPctWords,
  signedValueWords,
  type BenchUnit,
} from '@shared/bench';
import type { InjectorFlag, PointResult, SheetStatus, TestPoint } from '@shared/schemas/bench';
import { formatIsoDate } from '@shared/format';

export { pctWords, ratioWords, roundForWords, signedPctWords, signedValueWords };

export const unitText = (unit: BenchUnit) => benchUnitLabels[unit];

/** "52.25", or an en dash for a value that was not measured. */
export function valueText(value: number | null): string {
  return value === null ? '–' : roundForWords(value);
}

/** "±1 %" or "±0.5 mm³/stroke". */
export function toleranceText(point: Pick<TestPoint, 'tolerance' | 'unit'>): string {
  return point.tolerance.type === 'percent'
    ? `±${pctWords(point.tolerance.value)}`
    : `±${roundForWords(point.tolerance.value)} ${unitText(point.unit)}`;
}

/** How far an injector is off the set mean, in the tolerance's own terms. */
export function deviationText(
  point: Pick<PointResult, 'tolerance' | 'unit'>,
  deviation: number | null,
  deviationPct: number | null,
): string | null {
  if (deviation === null) return null;
  if (point.tolerance.type === 'percent' && deviationPct !== null)
    return signedPctWords(deviationPct);
  return signedValueWords(deviation, point.unit);
}

/** Short words for a cell's flags, worst first. */
export const flagShort: Record<InjectorFlag, string> = {
  worn: 'Worn',
  'over-limit': 'Over limit',
  low: 'Low',
  high: 'High',
  'below-nominal': 'Below spec',
  'above-nominal': 'Above spec',
};

const flagOrder: InjectorFlag[] = [
  'worn',
  'over-limit',
  'low',
  'high',
  'below-nominal',
  'above-nominal',
];

export function sortedFlags(flags: readonly InjectorFlag[]): InjectorFlag[] {
  return flagOrder.filter((f) => flags.includes(f));
}

export const sheetStatusLabels: Record<SheetStatus, string> = {
  'in-tolerance': 'Within tolerance',
  'out-of-tolerance': 'Out of tolerance',
  'not-judged': 'Not judged',
  'no-values': 'No values yet',
};

export const dateText = (iso: string) => formatIsoDate(iso);
