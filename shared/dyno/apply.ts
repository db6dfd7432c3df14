/**
 * Applying a correction to a run on read. Runs are stored as measured;
 * corrected power = factor × measured power, and corrected torque = factor ×
 * measured torque (a correction scales the whole curve: rpm does not change).
 */
import type { BsfcUnit } from '@shared/units/convert';
import {
  basisForDynoKind,
  type CorrectedRun,
  type CorrectionChoice,
  type CorrectionResult,
  type DynoFigure,
  type DynoKind,
  type DynoRunFields,
  type EngineAspiration,
  type PowerBasis,
  type RunPeaks,
  type Weather,
} from '@shared/schemas/dyno';
import { correctionFactor } from './correction';
import { completeCurve, curvePeaks } from './curve';
import { dynoFigure, fmt, step, withUnit, working } from './working';

/** The parts of a run the corrections read. */
export type DynoRunData = Pick<DynoRunFields, 'powerUnit' | 'torqueUnit' | 'boostUnit'> &
  Partial<
    Pick<
      DynoRunFields,
      'peakPower' | 'peakPowerRpm' | 'peakTorque' | 'peakTorqueRpm' | 'boost' | 'weather' | 'curve'
    >
  >;

/** The weather a run was made in: its own, else its session's, else none. */
export function effectiveWeather(
  run: { weather?: Weather | null },
  session: { weather?: Weather | null } | null | undefined,
): Weather | null {
  return run.weather ?? session?.weather ?? null;
}

/**
 * A run's measured peaks: each as the owner typed it, or else found in the
 * curve (see curvePeaks), or else null.
 */
export function runPeaks(run: DynoRunData): RunPeaks {
  const fromCurve = curvePeaks(run.curve ?? [], run.powerUnit, run.torqueUnit);
  const enteredPower = run.peakPower != null && run.peakPowerRpm != null;
  const enteredTorque = run.peakTorque != null && run.peakTorqueRpm != null;
  return {
    power: enteredPower ? run.peakPower! : fromCurve.power,
    powerRpm: enteredPower ? run.peakPowerRpm! : fromCurve.powerRpm,
    powerSource: enteredPower ? 'entered' : fromCurve.powerSource,
    torque: enteredTorque ? run.peakTorque! : fromCurve.torque,
    torqueRpm: enteredTorque ? run.peakTorqueRpm! : fromCurve.torqueRpm,
    torqueSource: enteredTorque ? 'entered' : fromCurve.torqueSource,
  };
}

function correctedFigure(
  what: 'power' | 'torque',
  measured: number,
  rpm: number,
  unit: string,
  source: RunPeaks['powerSource'],
  c: CorrectionResult,
): DynoFigure {
  const value = c.factor * measured;
  const name = what === 'power' ? 'peak power' : 'peak torque';
  return dynoFigure(
    c.standard === 'uncorrected' || !c.applied ? `Measured ${name}` : `Corrected ${name}`,
    value,
    unit,
    working(
      what === 'power' ? 'P_corrected = CF × P_measured' : 'T_corrected = CF × T_measured',
      [
        {
          name: `Measured ${name}${source === 'curve' ? ' (from the curve)' : ''}`,
          value: measured,
          unit,
          from: 'run',
          ref: what === 'power' ? 'peakPower' : 'peakTorque',
        },
        { name: `rpm at ${name}`, value: rpm, unit: 'rpm', from: 'run' },
        { name: `Correction factor (${c.label})`, value: c.factor, unit: 'factor', from: 'figure' },
      ],
      [],
      [
        step(
          c.standard === 'uncorrected' || !c.applied ? `Measured ${name}` : `Corrected ${name}`,
          `${fmt(c.factor)} × ${withUnit(measured, unit)} = ${withUnit(value, unit)}`,
          value,
          unit,
        ),
      ],
    ),
  );
}

/**
 * A run under a correction: measured and corrected peaks (in the run's
 * units), the corrected peaks as figures with their working, and the curve
 * sorted, completed (P = 2πnT/60) and corrected. `basis` is where the dyno
 * measured: wheel for a chassis dyno, crank for an engine dyno.
 */
export function correctRun(
  run: DynoRunData,
  correction: CorrectionResult,
  basis: PowerBasis,
): CorrectedRun {
  const measured = runPeaks(run);
  const f = correction.factor;
  const corrected: RunPeaks = {
    ...measured,
    power: measured.power == null ? null : f * measured.power,
    torque: measured.torque == null ? null : f * measured.torque,
  };
  return {
    correction,
    basis,
    powerUnit: run.powerUnit,
    torqueUnit: run.torqueUnit,
    measured,
    corrected,
    peakPower:
      measured.power == null
        ? null
        : correctedFigure(
            'power',
            measured.power,
            measured.powerRpm!,
            run.powerUnit,
            measured.powerSource,
            correction,
          ),
    peakTorque:
      measured.torque == null
        ? null
        : correctedFigure(
            'torque',
            measured.torque,
            measured.torqueRpm!,
            run.torqueUnit,
            measured.torqueSource,
            correction,
          ),
    curve: completeCurve(run.curve ?? [], run.powerUnit, run.torqueUnit).map((r) => ({
      ...r,
      power: f * r.power,
      torque: f * r.torque,
    })),
  };
}

/** What a run's correction needs beyond the run: the session and, for R85, the engine. */
export type RunContext = {
  dynoKind: DynoKind;
  /** The session's weather, used when the run has none of its own. */
  sessionWeather?: Weather | null;
  /** From the build and the estimator's assumptions, for R85's engine factor. */
  engine?: {
    aspiration: EngineAspiration;
    displacementL: number | null;
    bsfc: number | null;
    bsfcUnit: BsfcUnit;
    /** Takes a chassis-dyno (wheel) figure back to the crank for the fuel flow. */
    drivetrainLossPct: number | null;
  } | null;
};

/**
 * The correction factor for a run under the owner's choice, and the run
 * corrected by it: weather from the run or its session; for R85 the engine
 * factor from the run's measured peak power, its rpm and boost, the build's
 * displacement and the BSFC assumption, or the chosen f_m.
 */
export function correctRunFor(
  run: DynoRunData,
  choice: CorrectionChoice,
  context: RunContext,
): CorrectedRun {
  const basis = basisForDynoKind[context.dynoKind];
  const weather = effectiveWeather(run, { weather: context.sessionWeather });
  const peaks = runPeaks(run);
  const engine = context.engine ?? null;
  const aspiration = choice.aspiration ?? engine?.aspiration ?? 'turbocharged';
  const correction = correctionFactor({
    standard: choice.standard,
    weather,
    r85: {
      aspiration,
      chosenEngineFactor: choice.engineFactor ?? null,
      run: engine
        ? {
            power: peaks.power,
            powerUnit: run.powerUnit,
            rpm: peaks.powerRpm,
            basis,
            drivetrainLossPct: engine.drivetrainLossPct,
            bsfc: engine.bsfc,
            bsfcUnit: engine.bsfcUnit,
            displacementL: engine.displacementL,
            boost: run.boost ?? null,
            boostUnit: run.boostUnit,
          }
        : null,
    },
  });
  return correctRun(run, correction, basis);
}
