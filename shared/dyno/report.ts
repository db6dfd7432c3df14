/**
 * A dyno day read against the plan, in one pure function the server answers
 * with and the page recomputes when the owner switches standards: every run
 * corrected under the chosen standard (stored figures are never touched), the
 * best run, the best against the build's target and against the estimator's
 * "most the build supports", and the target moved to the session's basis for
 * the chart. Across sessions, the build's best result and the drivetrain loss
 * implied by a crank and a wheel figure.
 */
import {
  basisForDynoKind,
  type CorrectedRun,
  type CorrectionChoice,
  type DynoFigure,
  type DynoKind,
  type DynoPlan,
  type PowerBasis,
  type RunStatus,
  type Weather,
} from '@shared/schemas/dyno';
import { correctRunFor, runPeaks, type DynoRunData, type RunContext } from './apply';
import { convertBasis, drivetrainLossSource, impliedDrivetrainLoss } from './basis';
import {
  bestRun,
  progressTowardTarget,
  versusSupported,
  type BestRun,
  type SupportedComparison,
  type TargetProgress,
} from './compare';
import { dynoFigure, fmt, step, withUnit, working } from './working';

/** A stored run as the report reads it. */
export type ReportRunInput = DynoRunData & { id: string; status: RunStatus; runNumber?: number };

export type ReportRun = { id: string; status: RunStatus; corrected: CorrectedRun };

export type SessionReport = {
  choice: CorrectionChoice;
  /** Where the session's dyno measured. */
  basis: PowerBasis;
  runs: ReportRun[];
  /** The complete run with the highest corrected peak power; null when there is none. */
  best: BestRun | null;
  /** The best run against the build's target, in the target's basis. */
  vsTarget: TargetProgress | null;
  /** The best run against the most the build supports, in the target's basis. */
  vsSupported: SupportedComparison | null;
  /** The target power in this session's basis (moved with the drivetrain loss when the bases differ). */
  targetPower: DynoFigure;
  /** The target torque (a crank figure) in this session's basis, lbf·ft; null when the build has none. */
  targetTorque: DynoFigure | null;
};

/**
 * The run as R85 reads it: when no boost at peak power was typed in, the
 * boost its curve logged at the peak-power rpm (a curve imported from the
 * dyno's file usually carries one).
 */
export function withCurveBoost<T extends DynoRunData>(run: T): T {
  if (run.boost != null || !run.curve?.length) return run;
  const { powerRpm } = runPeaks(run);
  const row = run.curve.find((r) => r.rpm === powerRpm && r.boost != null);
  return row ? { ...run, boost: row.boost } : run;
}

/** The context a session gives each of its runs. */
export function runContext(
  session: { dynoKind: DynoKind; weather: Weather | null },
  plan: DynoPlan,
): RunContext {
  return { dynoKind: session.dynoKind, sessionWeather: session.weather, engine: plan.engine };
}

/** The build's target torque (crank, lbf·ft) moved to `basis` the way power is: × (1 − loss) at the wheels. */
function targetTorqueAt(plan: DynoPlan, basis: PowerBasis): DynoFigure | null {
  const torque = plan.target.torqueLbft;
  if (torque == null) return null;
  const input = {
    name: 'Target torque (crank)',
    value: torque,
    unit: 'lbf-ft',
    from: 'build' as const,
    ref: 'targetTorqueLbft',
  };
  if (basis === 'crank') {
    return dynoFigure('Target torque', torque, 'lbf-ft', working('crank torque as given', [input]));
  }
  const loss = plan.drivetrainLossPct;
  const value = torque * (1 - loss / 100);
  return dynoFigure(
    'Target torque at the wheels',
    value,
    'lbf-ft',
    working(
      'wheel = crank × (1 − loss): at one rpm torque scales as power does',
      [
        input,
        {
          name: 'Drivetrain loss',
          value: loss,
          unit: '%',
          from: 'assumption',
          ref: 'drivetrainLossPct',
        },
      ],
      [{ name: 'Drivetrain loss', value: loss, unit: '%', source: drivetrainLossSource }],
      [
        step(
          'Target torque at the wheels',
          `${withUnit(torque, 'lbf-ft')} × (1 − ${fmt(loss)} %) = ${withUnit(value, 'lbf-ft')}`,
          value,
          'lbf-ft',
        ),
      ],
    ),
  );
}

/** The supported figure in the target's basis, hp. */
function supportedAt(plan: DynoPlan) {
  if (!plan.supported) return null;
  const basis = plan.target.basis;
  const powerHp = basis === 'crank' ? plan.supported.crankPowerHp : plan.supported.wheelPowerHp;
  return powerHp > 0 ? { powerHp, basis } : null;
}

/**
 * One session's runs under `choice`, read against the plan. Runs should be
 * in pull order; the best is the earlier on a tie.
 */
export function sessionReport(
  session: { dynoKind: DynoKind; weather: Weather | null },
  runs: readonly ReportRunInput[],
  choice: CorrectionChoice,
  plan: DynoPlan,
): SessionReport {
  const basis = basisForDynoKind[session.dynoKind];
  const context = runContext(session, plan);
  const corrected: ReportRun[] = runs.map((r) => ({
    id: r.id,
    status: r.status,
    corrected: correctRunFor(withCurveBoost(r), choice, context),
  }));
  const best = bestRun(corrected);
  const loss = plan.drivetrainLossPct;
  const at = best ? { value: best.peakPowerHp, unit: 'hp' as const, basis: best.basis } : null;
  const supported = supportedAt(plan);
  return {
    choice,
    basis,
    runs: corrected,
    best,
    vsTarget: at ? progressTowardTarget(at, plan.target, loss) : null,
    vsSupported: at && supported ? versusSupported(at, supported, loss) : null,
    targetPower: convertBasis(
      { value: plan.target.powerHp, unit: 'hp', basis: plan.target.basis },
      basis,
      loss,
    ),
    targetTorque: targetTorqueAt(plan, basis),
  };
}

/** A session's report without the corrected curves: what a summary or a list needs. */
export function withoutCurves(report: SessionReport): SessionReport {
  return {
    ...report,
    runs: report.runs.map((r) => ({ ...r, corrected: { ...r.corrected, curve: [] } })),
  };
}

/** The best run of one session, named so a page can link to it. */
export type BestResult = BestRun & {
  sessionId: string;
  date: string;
  dynoKind: DynoKind;
  runNumber: number | null;
};

export type BuildDynoReport = {
  choice: CorrectionChoice;
  /** The best result of the build, compared in the target's basis; null before any complete run. */
  best: BestResult | null;
  vsTarget: TargetProgress | null;
  vsSupported: SupportedComparison | null;
  /** The best crank (engine dyno) and wheel (chassis dyno) results, each corrected alike. */
  bestCrank: BestResult | null;
  bestWheel: BestResult | null;
  /** loss = 1 − wheel ÷ crank, when both a crank and a wheel figure exist. */
  impliedLoss: { loss: DynoFigure; message: string | null } | null;
};

export type ReportSessionInput = {
  id: string;
  date: string;
  dynoKind: DynoKind;
  weather: Weather | null;
  runs: readonly ReportRunInput[];
};

/**
 * The build's dyno results under `choice`: each session's best run; the best
 * of them in the target's basis (a result on the other basis is moved with
 * the drivetrain loss assumption, and its working says so) against the target
 * and what the build supports; and, when there is both a crank and a wheel
 * result, the drivetrain loss they imply.
 */
export function buildReport(
  sessions: readonly ReportSessionInput[],
  choice: CorrectionChoice,
  plan: DynoPlan,
): { report: BuildDynoReport; sessions: { id: string; report: SessionReport }[] } {
  const perSession = sessions.map((s) => ({
    session: s,
    report: sessionReport(s, s.runs, choice, plan),
  }));
  const results: { result: BestResult; progress: TargetProgress }[] = [];
  for (const { session, report } of perSession) {
    if (!report.best || !report.vsTarget) continue;
    results.push({
      result: {
        ...report.best,
        sessionId: session.id,
        date: session.date,
        dynoKind: session.dynoKind,
        runNumber: session.runs.find((r) => r.id === report.best!.id)?.runNumber ?? null,
      },
      progress: report.vsTarget,
    });
  }
  const top = (list: typeof results) =>
    list.reduce<(typeof results)[number] | null>(
      (best, r) =>
        best === null || r.progress.achieved.value > best.progress.achieved.value ? r : best,
      null,
    );
  const best = top(results);
  const bestCrank = top(results.filter((r) => r.result.basis === 'crank'))?.result ?? null;
  const bestWheel = top(results.filter((r) => r.result.basis === 'wheel'))?.result ?? null;
  const supported = supportedAt(plan);
  const at = best
    ? { value: best.result.peakPowerHp, unit: 'hp' as const, basis: best.result.basis }
    : null;
  return {
    report: {
      choice,
      best: best?.result ?? null,
      vsTarget: best?.progress ?? null,
      vsSupported: at && supported ? versusSupported(at, supported, plan.drivetrainLossPct) : null,
      bestCrank,
      bestWheel,
      impliedLoss:
        bestCrank && bestWheel && bestCrank.peakPowerHp > 0
          ? impliedDrivetrainLoss(
              { value: bestCrank.peakPowerHp, unit: 'hp' },
              { value: bestWheel.peakPowerHp, unit: 'hp' },
            )
          : null,
    },
    sessions: perSession.map(({ session, report }) => ({ id: session.id, report })),
  };
}
