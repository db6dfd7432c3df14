/**
 * What an unbalanced injector set costs at the build's target power, by a rule
 * of thumb with no published source (../shared/reference.md, "Flow-bench
 * statistics"): when the tune must keep the richest cylinder within its smoke
 * and temperature limit, the set gives up roughly the richest cylinder's
 * excess over the mean as a share of peak power (about 2 % for a 4–5 %
 * spread). So, at full load,
 *
 *   cost % ≈ 100 · (max − mean) / mean,  cost hp = target hp × cost % / 100.
 *
 * The figures carry their working (inputs, every step with its number, and the
 * rule with its status) so the page can show how they were reached.
 */
import type {
  BenchFigure,
  BenchPowerTarget,
  BenchWorkingInput,
  BenchWorkingStep,
  ImbalanceCost,
  ImbalanceRecovery,
} from '@shared/schemas/bench';
import { analyseBenchPoint, type BenchPointInput } from './analyse';
import { BENCH_MAX_CYLINDERS } from './limits';
import { benchUnitLabels } from './units';
import { hpWords, labelInSentence, pctWords, roundForWords } from './words';

/** The rule the imbalance cost rests on, as the page shows it. */
export const IMBALANCE_COST_RULE =
  "When the tune keeps the richest cylinder within its smoke and temperature limit, the set gives up roughly the richest injector's excess over the mean at full load as a share of peak power (about 2 % for a 4–5 % spread).";

/** The rule with its status: a rule of thumb, not a published figure. */
export const imbalanceCostRule = {
  wording: IMBALANCE_COST_RULE,
  status: 'rule of thumb',
  source: '../shared/reference.md, "Flow-bench statistics": rule of thumb, no published source',
} as const;

function hpUnit(target: BenchPowerTarget) {
  return target.basis === 'crank' ? 'hp-crank' : 'hp-wheel';
}

function checkTarget(target: BenchPowerTarget) {
  if (!Number.isFinite(target.powerHp) || target.powerHp <= 0) {
    throw new RangeError(
      `target.powerHp must be a finite number above zero (got ${target.powerHp})`,
    );
  }
}

/**
 * The power the set's imbalance costs at the target, from the sheet's first
 * full-load point. `{ available: false, reason }` when the sheet has no
 * full-load point, fewer than two values there, or a mean of zero.
 */
export function imbalanceCost(
  sheet: { points: readonly BenchPointInput[] },
  target: BenchPowerTarget,
  options: { cylinders?: number } = {},
): ImbalanceCost {
  checkTarget(target);
  const index = sheet.points.findIndex((p) => p.kind === 'full-load');
  if (index < 0) return { available: false, reason: 'The sheet has no full-load point' };
  const point = sheet.points[index]!;
  const cylinders = options.cylinders ?? Math.max(1, ...sheet.points.map((p) => p.values.length));
  if (!Number.isInteger(cylinders) || cylinders < 1 || cylinders > BENCH_MAX_CYLINDERS) {
    throw new RangeError(
      `cylinders must be a whole number from 1 to ${BENCH_MAX_CYLINDERS} (got ${cylinders})`,
    );
  }
  const r = analyseBenchPoint(point, index, cylinders);
  const { n, mean, max } = r.statistics;
  const at = labelInSentence(point.label);
  if (n < 2 || mean === null || max === null) {
    return { available: false, reason: `Fewer than two injectors measured at ${at}` };
  }
  if (mean <= 0) return { available: false, reason: `The mean at ${at} is zero` };

  const richest = r.injectors.find((i) => i.value === max)!;
  const unit = point.unit;
  const u = benchUnitLabels[unit];
  const excess = max - mean;
  const share = (100 * excess) / mean;
  const hp = (target.powerHp * share) / 100;
  const hpU = hpUnit(target);

  const inMax: BenchWorkingInput = {
    name: `Richest injector at ${at} (injector ${richest.position})`,
    value: max,
    unit,
    from: 'sheet',
    ref: `points.${index}.values.${richest.position - 1}`,
  };
  const inMean: BenchWorkingInput = {
    name: `Mean at ${at} (${n} injector${n === 1 ? '' : 's'} measured)`,
    value: mean,
    unit,
    from: 'sheet',
    ref: `points.${index}`,
  };
  const shareSteps: BenchWorkingStep[] = [
    {
      text: `Mean of the ${n} values at ${at} = ${roundForWords(mean)} ${u}`,
      value: mean,
      unit,
    },
    {
      text: `Richest: injector ${richest.position} at ${roundForWords(max)} ${u}`,
      value: max,
      unit,
    },
    {
      text: `Excess over the mean = ${roundForWords(max)} − ${roundForWords(mean)} = ${roundForWords(excess)} ${u}`,
      value: excess,
      unit,
    },
    {
      text: `Share of peak power given up = 100 × ${roundForWords(excess)} ÷ ${roundForWords(mean)} = ${pctWords(share)}`,
      value: share,
      unit: '%',
    },
  ];
  const sharePct: BenchFigure = {
    label: 'Share of peak power the imbalance costs',
    value: share,
    unit: '%',
    working: {
      formula: 'cost % ≈ 100 × (max − mean) ÷ mean, at full load',
      inputs: [inMax, inMean],
      constants: [],
      steps: shareSteps,
      rule: { ...imbalanceCostRule },
    },
  };
  const power: BenchFigure = {
    label: 'Power the imbalance costs at the target',
    value: hp,
    unit: hpU,
    working: {
      formula: 'cost hp = target hp × cost % ÷ 100',
      inputs: [
        {
          name: `Target (${target.basis})`,
          value: target.powerHp,
          unit: hpU,
          from: 'build',
          ref: 'targetPowerHp',
        },
        {
          name: sharePct.label,
          value: share,
          unit: '%',
          from: 'figure',
          ref: 'sharePct',
        },
      ],
      constants: [],
      steps: [
        ...shareSteps,
        {
          text: `Power given up = ${roundForWords(target.powerHp)} hp × ${pctWords(share)} ÷ 100 = ${roundForWords(hp)} hp`,
          value: hp,
          unit: hpU,
        },
      ],
      rule: { ...imbalanceCostRule },
    },
  };
  return {
    available: true,
    pointIndex: index,
    pointLabel: point.label,
    richestPosition: richest.position,
    sharePct,
    power,
    summary: `Imbalance at ${at} costs about ${hpWords(hp)} of the ${roundForWords(target.powerHp)} ${target.basis} hp target (${pctWords(share)}, rule of thumb)`,
  };
}

/**
 * The power a rebuild won back: the imbalance cost of `before` less that of
 * `after` at the same target (negative when the after set is worse).
 */
export function imbalanceCostRecovered(
  before: { points: readonly BenchPointInput[] },
  after: { points: readonly BenchPointInput[] },
  target: BenchPowerTarget,
  options: { cylinders?: number } = {},
): ImbalanceRecovery {
  const b = imbalanceCost(before, target, options);
  const a = imbalanceCost(after, target, options);
  if (!b.available || !a.available) {
    const reason = !b.available
      ? `Before: ${b.reason}`
      : `After: ${(a as { reason: string }).reason}`;
    return { before: b, after: a, recovered: null, reason, summary: reason };
  }
  const value = b.power.value - a.power.value;
  const hpU = hpUnit(target);
  return {
    before: b,
    after: a,
    recovered: {
      label: 'Power the rebuild recovers at the target',
      value,
      unit: hpU,
      working: {
        formula: 'recovered hp = cost hp before − cost hp after',
        inputs: [
          { name: 'Cost before', value: b.power.value, unit: hpU, from: 'figure', ref: 'before' },
          { name: 'Cost after', value: a.power.value, unit: hpU, from: 'figure', ref: 'after' },
        ],
        constants: [],
        steps: [
          {
            text: `Before: ${roundForWords(target.powerHp)} hp × ${pctWords(b.sharePct.value)} ÷ 100 = ${roundForWords(b.power.value)} hp`,
            value: b.power.value,
            unit: hpU,
          },
          {
            text: `After: ${roundForWords(target.powerHp)} hp × ${pctWords(a.sharePct.value)} ÷ 100 = ${roundForWords(a.power.value)} hp`,
            value: a.power.value,
            unit: hpU,
          },
          {
            text: `Recovered = ${roundForWords(b.power.value)} hp − ${roundForWords(a.power.value)} hp = ${roundForWords(value)} hp`,
            value,
            unit: hpU,
          },
        ],
        rule: { ...imbalanceCostRule },
      },
    },
    reason: null,
    summary:
      value >= 0
        ? `The rebuild recovers about ${hpWords(value)} at the ${roundForWords(target.powerHp)} ${target.basis} hp target (rule of thumb)`
        : `The after set costs about ${hpWords(-value)} more at the ${roundForWords(target.powerHp)} ${target.basis} hp target (rule of thumb)`,
  };
}
