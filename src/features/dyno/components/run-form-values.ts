import {
  defaultRunUnits,
  type CreateDynoRunInput,
  type DynoRun,
  type RunStatus,
  type RunUnits,
} from '@shared/schemas/dyno';
import { numberToInput, parseNumber } from '@shared/numbers';
import { weatherFromForm, weatherToForm, type WeatherFormValues } from '../form';

/* The run form's values: what the boxes hold, and the conversions to and from a run. */

export type RunFormValues = WeatherFormValues &
  RunUnits & {
    status: RunStatus;
    abortReason: string;
    gear: string;
    tuneRevision: string;
    notes: string;
    peakPower: string;
    peakPowerRpm: string;
    peakTorque: string;
    peakTorqueRpm: string;
    boost: string;
    egt: string;
    mixture: string;
    ownWeather: boolean;
  };

/** The boxes as the API's input: numbers read, the unit switches of a run with a curve kept. */
export function toInput(v: RunFormValues, run: DynoRun | undefined): CreateDynoRunInput {
  const curve = run?.curve.length ? run.curve : null;
  // A run with a curve keeps its units (their boxes are disabled, so the form may not hold them).
  const unit = <K extends keyof RunUnits>(key: K): RunUnits[K] =>
    (curve && run ? run[key] : undefined) ?? v[key];
  return {
    status: v.status,
    abortReason: v.status === 'aborted' ? v.abortReason : null,
    gear: v.gear,
    tuneRevision: v.tuneRevision,
    notes: v.notes,
    powerUnit: unit('powerUnit'),
    torqueUnit: unit('torqueUnit'),
    boostUnit: unit('boostUnit'),
    egtUnit: unit('egtUnit'),
    mixtureKind: unit('mixtureKind'),
    peakPower: parseNumber(v.peakPower),
    peakPowerRpm: parseNumber(v.peakPowerRpm),
    peakTorque: parseNumber(v.peakTorque),
    peakTorqueRpm: parseNumber(v.peakTorqueRpm),
    boost: parseNumber(v.boost),
    egt: parseNumber(v.egt),
    mixture: parseNumber(v.mixture),
    weather: v.ownWeather ? weatherFromForm(v) : null,
    // The stored curve is checked with the run (its boost, EGT and mixture follow the units).
    curve,
  };
}

/** A saved run (or none) as the boxes show it. */
export function defaults(run?: DynoRun): RunFormValues {
  return {
    status: run?.status ?? 'complete',
    abortReason: run?.abortReason ?? '',
    gear: run?.gear ?? '',
    tuneRevision: run?.tuneRevision ?? '',
    notes: run?.notes ?? '',
    powerUnit: run?.powerUnit ?? defaultRunUnits.powerUnit,
    torqueUnit: run?.torqueUnit ?? defaultRunUnits.torqueUnit,
    boostUnit: run?.boostUnit ?? defaultRunUnits.boostUnit,
    egtUnit: run?.egtUnit ?? defaultRunUnits.egtUnit,
    mixtureKind: run?.mixtureKind ?? defaultRunUnits.mixtureKind,
    peakPower: numberToInput(run?.peakPower),
    peakPowerRpm: numberToInput(run?.peakPowerRpm),
    peakTorque: numberToInput(run?.peakTorque),
    peakTorqueRpm: numberToInput(run?.peakTorqueRpm),
    boost: numberToInput(run?.boost),
    egt: numberToInput(run?.egt),
    mixture: numberToInput(run?.mixture),
    ownWeather: Boolean(run?.weather),
    ...weatherToForm(run?.weather ?? null),
  };
}
