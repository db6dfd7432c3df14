/**
 * Comparing dyno results: the best run of a set, progress toward the build's
 * target, and the result against the most the build supports (the
 * estimator's `supported`). Figures are compared in one basis — the target's
 * or the estimate's — moving a measured figure across with the drivetrain
 * loss when the bases differ (shared/dyno/basis.ts), and in hp.
 */
import { convertPower } from '@shared/units/convert';
import type {
  CorrectedRun,
  DynoFigure,
  DynoWorkingInput,
  PowerBasis,
  RunStatus,
} from '@shared/schemas/dyno';
import { convertBasis, type PowerAt } from './basis';
import { dynoFigure, fmt, step, withUnit, working } from './working';

/**
 * Relative slack when deciding "reached" and "beyond": a figure moved across
 * bases comes back a few ulps off (410 ÷ 0.82 = 499.99999999999994), and a
 * result equal to the target has reached it. 1e-9 is far below any dyno's
 * resolution.
 */
export const COMPARE_SLACK = 1e-9;

/** A run as the comparisons see it: its id, whether it went the whole way, and its corrected figures. */
export type RunForComparison = { id: string; status: RunStatus; corrected: CorrectedRun };

export type BestRun = {
  id: string;
  /** Corrected peak power with its working, in the run's unit. */
  peakPower: DynoFigure;
  /** The same in hp, to compare runs typed in different units. */
  peakPowerHp: number;
  basis: PowerBasis;
};

/**
 * The complete run with the highest corrected peak power (compared in hp,
 * whatever unit each run was typed in); the earlier in the list on a tie.
 * Stopped runs and runs without a peak power are passed over; null when none
 * is left. Runs should share a basis (one session, or one kind of dyno).
 */
export function bestRun(runs: readonly RunForComparison[]): BestRun | null {
  let best: BestRun | null = null;
  for (const r of runs) {
    const figure = r.corrected.peakPower;
    if (r.status !== 'complete' || figure === null) continue;
    const hp = convertPower(figure.value, r.corrected.powerUnit, 'hp');
    if (best === null || hp > best.peakPowerHp) {
      best = { id: r.id, peakPower: figure, peakPowerHp: hp, basis: r.corrected.basis };
    }
  }
  return best;
}

function inHpAtBasis(
  power: PowerAt,
  basis: PowerBasis,
  drivetrainLossPct: number | undefined,
  what: string,
): { hp: number; figure: DynoFigure } {
  if (power.basis !== basis && drivetrainLossPct === undefined) {
    throw new RangeError(
      `drivetrainLossPct is needed to compare a ${power.basis} figure with a ${basis} ${what}`,
    );
  }
  const hpPower: PowerAt = {
    value: convertPower(power.value, power.unit, 'hp'),
    unit: 'hp',
    basis: power.basis,
  };
  const figure = convertBasis(hpPower, basis, drivetrainLossPct ?? 0);
  if (power.unit !== 'hp') {
    figure.working.steps.unshift(
      step(
        'In hp',
        `${withUnit(power.value, power.unit)} = ${withUnit(hpPower.value, 'hp')}`,
        hpPower.value,
        'hp',
      ),
    );
  }
  return { hp: figure.value, figure };
}

export type TargetProgress = {
  /** The measured figure in hp at the target's basis. */
  achieved: DynoFigure;
  /** achieved ÷ target × 100. */
  progressPct: DynoFigure;
  /** target − achieved, hp at the target's basis; negative once past the target. */
  remainingHp: number;
  reached: boolean;
};

/**
 * How far a (corrected) result has come toward the build's target, in the
 * target's basis: progress = achieved ÷ target × 100 %. The drivetrain loss
 * is needed only when the result and the target are on different bases.
 */
export function progressTowardTarget(
  achieved: PowerAt,
  target: { powerHp: number; basis: PowerBasis },
  drivetrainLossPct?: number,
): TargetProgress {
  if (!(Number.isFinite(target.powerHp) && target.powerHp > 0)) {
    throw new RangeError(
      `target.powerHp must be a finite number above zero (got ${target.powerHp})`,
    );
  }
  const { hp, figure } = inHpAtBasis(achieved, target.basis, drivetrainLossPct, 'target');
  const pct = (hp / target.powerHp) * 100;
  const inputs: DynoWorkingInput[] = [
    { name: `Result (${target.basis} hp)`, value: hp, unit: 'hp', from: 'figure' },
    {
      name: `Target (${target.basis} hp)`,
      value: target.powerHp,
      unit: 'hp',
      from: 'build',
      ref: 'targetPowerHp',
    },
  ];
  return {
    achieved: figure,
    progressPct: dynoFigure(
      'Progress toward the target',
      pct,
      '%',
      working(
        'progress = result ÷ target × 100 (same basis)',
        inputs,
        [],
        [step('Progress', `${fmt(hp)} ÷ ${fmt(target.powerHp)} × 100 = ${fmt(pct)} %`, pct, '%')],
      ),
    ),
    remainingHp: target.powerHp - hp,
    reached: hp >= target.powerHp * (1 - COMPARE_SLACK),
  };
}

export type SupportedComparison = {
  /** The measured figure in hp at the estimate's basis. */
  achieved: DynoFigure;
  /** achieved ÷ supported × 100. */
  pctOfSupported: DynoFigure;
  /** supported − achieved, hp; negative when the result is past what the rated parts support. */
  marginHp: number;
  /** True when the result is above what the estimator says the rated parts support. */
  beyondSupported: boolean;
};

/**
 * A (corrected) result against the estimator's "most the build supports"
 * (EstimateResult.supported: crankPower or wheelPower, in hp), in that
 * figure's basis: share = achieved ÷ supported × 100 %.
 */
export function versusSupported(
  achieved: PowerAt,
  supported: { powerHp: number; basis: PowerBasis },
  drivetrainLossPct?: number,
): SupportedComparison {
  if (!(Number.isFinite(supported.powerHp) && supported.powerHp > 0)) {
    throw new RangeError(
      `supported.powerHp must be a finite number above zero (got ${supported.powerHp})`,
    );
  }
  const { hp, figure } = inHpAtBasis(achieved, supported.basis, drivetrainLossPct, 'estimate');
  const pct = (hp / supported.powerHp) * 100;
  return {
    achieved: figure,
    pctOfSupported: dynoFigure(
      'Share of what the rated parts support',
      pct,
      '%',
      working(
        'share = result ÷ most the build supports × 100 (same basis)',
        [
          { name: `Result (${supported.basis} hp)`, value: hp, unit: 'hp', from: 'figure' },
          {
            name: `Most the build supports (${supported.basis} hp)`,
            value: supported.powerHp,
            unit: 'hp',
            from: 'figure',
            ref: 'supported',
          },
        ],
        [],
        [step('Share', `${fmt(hp)} ÷ ${fmt(supported.powerHp)} × 100 = ${fmt(pct)} %`, pct, '%')],
      ),
    ),
    marginHp: supported.powerHp - hp,
    beyondSupported: hp > supported.powerHp * (1 + COMPARE_SLACK),
  };
}
