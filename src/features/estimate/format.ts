import { figureUnitLabels } from '@shared/estimate';
import type { PartCategory } from '@shared/schemas/parts';
import { formatNumber } from '@shared/format';

/** Decimals worth showing for a figure in a unit (ratios and densities need more). */
function digitsFor(unit: string, value: number): number {
  // Percentages to one decimal everywhere (cards, chart, working), so they never disagree.
  if (unit === '%') return 1;
  if (unit === 'lambda') return 2;
  if (unit === 'kg-per-l' || unit === 'lb-per-hp-h') return 3;
  return Math.abs(value) < 10 ? 2 : 1;
}

export function unitLabel(unit: string): string {
  return figureUnitLabels[unit] ?? unit;
}

/** A figure for reading: "731.7 crank hp", "18:1", "λ 1.24", "3.9 %". */
export function formatFigure(value: number, unit: string, digits?: number): string {
  const n = formatNumber(value, digits ?? digitsFor(unit, value));
  if (unit === 'ratio') return `${n}:1`;
  if (unit === 'lambda') return `λ ${n}`;
  if (unit === 'count') return `× ${n}`;
  return `${n} ${unitLabel(unit)}`;
}

/** Headroom with its sign: "+3.9 %", "−4.2 %". */
export function formatHeadroom(pct: number): string {
  const n = formatNumber(Math.abs(pct), 1);
  if (n === '0') return '0 %';
  return `${pct < 0 ? '−' : '+'}${n} %`;
}

/**
 * How far a part is past its rating, on the one basis headroom uses (the requirement):
 * "50 crank hp (−6.7 % headroom)". shortfall.pct is −headroom %, so the two never disagree.
 */
export function formatShortfall(shortfall: { value: number; unit: string; pct: number }): string {
  return `${formatFigure(shortfall.value, shortfall.unit)} (${formatHeadroom(-shortfall.pct)} headroom)`;
}

/** How the headline names a part's category ("the bottom end gives out first"). */
const categoryPhrases: Record<PartCategory, string | null> = {
  'fuel-injection': 'the injectors',
  'fuel-supply': 'the fuel supply',
  turbocharger: 'the turbocharger',
  'air-intake': 'the air intake',
  exhaust: 'the exhaust',
  'head-and-studs': 'the head and studs',
  'bottom-end': 'the bottom end',
  transmission: 'the transmission',
  'torque-converter': 'the torque converter',
  driveline: 'the driveline',
  cooling: 'the cooling',
  tuning: 'the tuning',
  other: null,
};

export function categoryPhrase(category: PartCategory): string | null {
  return categoryPhrases[category];
}

export function capitalise(text: string): string {
  return text.charAt(0).toUpperCase() + text.slice(1);
}
