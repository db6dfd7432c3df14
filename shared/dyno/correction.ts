/**
 * Correcting dyno figures to standard conditions. Each standard gives a
 * factor; corrected power = factor × measured power, and torque alike
 * (shared/dyno/apply.ts). Runs are stored as measured and corrected on read.
 *
 * The formulas, as ../shared/reference.md ("Dynamometer correction") gives them:
 *
 * - SAE J1349 (AUG2004), as chassis-dyno operators commonly report it:
 *   CF = 1.18 × (99/p_d) × √((t+273)/298) − 0.18, p_d dry-air pressure in kPa,
 *   t in °C; reference 25 °C, 99 kPa dry air.
 * - UN ECE R85 Annex 5 / ISO 1585, compression ignition: α_d = f_a^f_m.
 *   Turbocharged f_a = (99/p_s)^0.7 × (T/298)^1.5; naturally aspirated
 *   f_a = (99/p_s) × (T/298)^0.7; p_s dry-air pressure in kPa, T in K taken as
 *   t + 273 (as J1349 writes it; reference.md's check values are computed
 *   this way — with 273.15 the factor moves by under 0.1 %).
 *   f_m = 0.036 q_c − 1.14 for 37.2 ≤ q_c ≤ 65 mg/(L·cycle), 0.3 below, 1.2
 *   above; q_c = q/r, q = 120000 × fuel[g/s] / (displacement[L] × rpm),
 *   r = absolute boost pressure ÷ barometric pressure. The standard allows
 *   0.9 ≤ α_d ≤ 1.1 only: outside it the factor is still returned, with
 *   `valid: false` and a plain message, never clipped or hidden.
 * - SAE J607 [memory]: CF = (29.92/P[inHg]) × √((t[°F]+460)/520), on total
 *   barometric pressure (humidity not used), as published.
 * - DIN 70020 [memory]: CF = (1013/p[mbar]) × √((273+t)/293), on total
 *   barometric pressure (humidity not used), as published.
 * - Uncorrected: factor 1.
 *
 * Every constant and its citation is in {@link correctionConstants}, so a
 * citation or a value is corrected in one place.
 */
import {
  convertBsfc,
  convertPower,
  convertPressure,
  convertTemperature,
  type BsfcUnit,
} from '@shared/units/convert';
import {
  correctionStandardLabels,
  engineFactorLimits,
  type BoostUnit,
  type CorrectionResult,
  type CorrectionStandard,
  type CorrectionWarning,
  type DynoPowerUnit,
  type DynoStep,
  type DynoWorkingInput,
  type EngineAspiration,
  type EngineFactorResult,
  type PowerBasis,
  type Weather,
  type WorkingConstant,
} from '@shared/schemas/dyno';
import { ambientFromWeather, type Ambient } from './vapour-pressure';
import { assertFinite, fmt, step, withUnit, working } from './working';

const sources = {
  j1349:
    'SAE J1349 (AUG2004), in the form chassis-dyno operators commonly report it (reference.md, "Dynamometer correction")',
  r85: 'UN ECE Regulation No. 85, Annex 5 / ISO 1585, compression-ignition engines (reference.md, "Dynamometer correction")',
  r85Kelvin: 'T = t + 273, as J1349 writes it and as reference.md’s R85 check values are computed',
  j607: 'SAE J607, as published [memory] (reference.md, "Dynamometer correction")',
  din: 'DIN 70020, as published [memory] (reference.md, "Dynamometer correction")',
  fourStroke:
    'four-stroke cycle: one cycle every two revolutions; 120000 = 1000 mg/g × 60 s/min × 2 rev/cycle',
} as const;

/** Every constant the corrections use, with its source. */
export const correctionConstants = {
  j1349Multiplier: {
    name: 'J1349 multiplier',
    value: 1.18,
    unit: 'ratio',
    source: sources.j1349,
  },
  j1349Offset: { name: 'J1349 offset', value: 0.18, unit: 'ratio', source: sources.j1349 },
  j1349Pressure: {
    name: 'J1349 reference dry-air pressure',
    value: 99,
    unit: 'kpa',
    source: sources.j1349,
  },
  j1349Temperature: {
    name: 'J1349 reference temperature (25 °C)',
    value: 298,
    unit: 'k',
    source: sources.j1349,
  },
  celsiusToKelvin: {
    name: 'kelvin at 0 °C, as the formulas write it',
    value: 273,
    unit: 'k',
    source: sources.r85Kelvin,
  },
  r85Pressure: {
    name: 'R85 reference dry-air pressure',
    value: 99,
    unit: 'kpa',
    source: sources.r85,
  },
  r85Temperature: {
    name: 'R85 reference temperature (25 °C)',
    value: 298,
    unit: 'k',
    source: sources.r85,
  },
  r85TurboPressureExponent: {
    name: 'R85 pressure exponent, turbocharged',
    value: 0.7,
    unit: 'ratio',
    source: sources.r85,
  },
  r85TurboTemperatureExponent: {
    name: 'R85 temperature exponent, turbocharged',
    value: 1.5,
    unit: 'ratio',
    source: sources.r85,
  },
  r85NaPressureExponent: {
    name: 'R85 pressure exponent, naturally aspirated',
    value: 1,
    unit: 'ratio',
    source: sources.r85,
  },
  r85NaTemperatureExponent: {
    name: 'R85 temperature exponent, naturally aspirated',
    value: 0.7,
    unit: 'ratio',
    source: sources.r85,
  },
  r85FmSlope: { name: 'f_m slope', value: 0.036, unit: 'ratio', source: sources.r85 },
  r85FmIntercept: { name: 'f_m intercept', value: 1.14, unit: 'ratio', source: sources.r85 },
  r85QcLow: {
    name: 'q_c where the f_m line starts',
    value: 37.2,
    unit: 'mg-per-l-cycle',
    source: sources.r85,
  },
  r85QcHigh: {
    name: 'q_c where the f_m line ends',
    value: 65,
    unit: 'mg-per-l-cycle',
    source: sources.r85,
  },
  r85FmFloor: {
    name: 'f_m below the line',
    value: engineFactorLimits.min,
    unit: 'ratio',
    source: sources.r85,
  },
  r85FmCeiling: {
    name: 'f_m above the line',
    value: engineFactorLimits.max,
    unit: 'ratio',
    source: sources.r85,
  },
  r85ValidLow: { name: 'lowest valid α_d', value: 0.9, unit: 'factor', source: sources.r85 },
  r85ValidHigh: { name: 'highest valid α_d', value: 1.1, unit: 'factor', source: sources.r85 },
  fuelDelivery: {
    name: 'mg/g × s/min × rev/cycle',
    value: 120_000,
    unit: 'ratio',
    source: sources.fourStroke,
  },
  j607Pressure: {
    name: 'J607 reference pressure',
    value: 29.92,
    unit: 'inhg',
    source: sources.j607,
  },
  j607Rankine: { name: '°F to °R offset', value: 460, unit: 'f', source: sources.j607 },
  j607Temperature: {
    name: 'J607 reference temperature (60 °F)',
    value: 520,
    unit: 'r',
    source: sources.j607,
  },
  dinPressure: {
    name: 'DIN 70020 reference pressure',
    value: 1013,
    unit: 'mbar',
    source: sources.din,
  },
  dinKelvin: {
    name: 'kelvin at 0 °C, as DIN 70020 writes it',
    value: 273,
    unit: 'k',
    source: sources.din,
  },
  dinTemperature: {
    name: 'DIN 70020 reference temperature (20 °C)',
    value: 293,
    unit: 'k',
    source: sources.din,
  },
} satisfies Record<string, WorkingConstant>;

const C = correctionConstants;

/**
 * f_m used when the run does not give what q_c needs and the owner chose
 * none: 0.3, the standard's lowest, so the correction stays the closest to
 * the measured figure (α_d = f_a^f_m is nearest 1 for the smallest f_m).
 */
export const DEFAULT_ENGINE_FACTOR = engineFactorLimits.min;

// ---------------------------------------------------------------- the formulas, bare

/** SAE J1349 (AUG2004): CF = 1.18 × (99/p_d) × √((t+273)/298) − 0.18. */
export function sae1349Factor(tempC: number, dryPressureKpa: number): number {
  return (
    C.j1349Multiplier.value *
      (C.j1349Pressure.value / dryPressureKpa) *
      Math.sqrt((tempC + C.celsiusToKelvin.value) / C.j1349Temperature.value) -
    C.j1349Offset.value
  );
}

/**
 * UN ECE R85 / ISO 1585 atmospheric factor f_a. Turbocharged:
 * (99/p_s)^0.7 × (T/298)^1.5; naturally aspirated: (99/p_s) × (T/298)^0.7;
 * T = t + 273 K, p_s dry-air pressure in kPa.
 */
export function r85AtmosphericFactor(
  tempC: number,
  dryPressureKpa: number,
  aspiration: EngineAspiration,
): number {
  const turbo = aspiration === 'turbocharged';
  const pExp = turbo ? C.r85TurboPressureExponent.value : C.r85NaPressureExponent.value;
  const tExp = turbo ? C.r85TurboTemperatureExponent.value : C.r85NaTemperatureExponent.value;
  const kelvin = tempC + C.celsiusToKelvin.value;
  return (C.r85Pressure.value / dryPressureKpa) ** pExp * (kelvin / C.r85Temperature.value) ** tExp;
}

/** Fuel delivery per litre and cycle: q = 120000 × fuel[g/s] / (displacement[L] × rpm), mg/(L·cycle). */
export function fuelDeliveryParameter(fuelGPerS: number, displacementL: number, rpm: number) {
  return (C.fuelDelivery.value * fuelGPerS) / (displacementL * rpm);
}

/** The branch of the f_m rule a q_c falls in. */
export type EngineFactorBranch = 'below' | 'line' | 'above';

export function engineFactorBranch(qc: number): EngineFactorBranch {
  if (qc < C.r85QcLow.value) return 'below';
  if (qc > C.r85QcHigh.value) return 'above';
  return 'line';
}

/**
 * R85 engine factor from the corrected fuel delivery q_c (mg/(L·cycle)):
 * 0.036 q_c − 1.14 for 37.2 ≤ q_c ≤ 65, 0.3 below, 1.2 above. Note that the
 * line gives 0.1992 at q_c = 37.2, below the 0.3 used under it: the rule is
 * implemented as reference.md states it, edges included in the line.
 */
export function r85EngineFactor(qc: number): number {
  const branch = engineFactorBranch(qc);
  if (branch === 'below') return C.r85FmFloor.value;
  if (branch === 'above') return C.r85FmCeiling.value;
  return C.r85FmSlope.value * qc - C.r85FmIntercept.value;
}

/** α_d = f_a ^ f_m. */
export function r85Factor(atmosphericFactor: number, engineFactor: number): number {
  return atmosphericFactor ** engineFactor;
}

/** Whether an R85 factor lies in the standard's 0.9 ≤ α_d ≤ 1.1. */
export function r85FactorValid(factor: number): boolean {
  return factor >= C.r85ValidLow.value && factor <= C.r85ValidHigh.value;
}

/** SAE J607 [memory]: CF = (29.92/P[inHg]) × √((t[°F]+460)/520). */
export function sae607Factor(tempF: number, pressureInHg: number): number {
  return (
    (C.j607Pressure.value / pressureInHg) *
    Math.sqrt((tempF + C.j607Rankine.value) / C.j607Temperature.value)
  );
}

/** DIN 70020 [memory]: CF = (1013/p[mbar]) × √((273+t)/293). */
export function din70020Factor(tempC: number, pressureMbar: number): number {
  return (
    (C.dinPressure.value / pressureMbar) *
    Math.sqrt((C.dinKelvin.value + tempC) / C.dinTemperature.value)
  );
}

// ---------------------------------------------------------------- R85 engine factor from a run

/**
 * What q_c needs from a run and its build. Any piece missing and f_m falls
 * back to the owner's choice (or {@link DEFAULT_ENGINE_FACTOR}), and the
 * result says why.
 */
export type EngineFactorRunInput = {
  /** Measured peak power and the rpm it came at. */
  power: number | null;
  powerUnit: DynoPowerUnit;
  rpm: number | null;
  /** Where the power was measured; wheel power is taken back to the crank with the drivetrain loss. */
  basis: PowerBasis;
  drivetrainLossPct?: number | null;
  /** Brake specific fuel consumption assumed at peak power (the estimator's assumption). */
  bsfc: number | null;
  bsfcUnit: BsfcUnit;
  /** Engine displacement from the build, litres. */
  displacementL: number | null;
  /** Boost (gauge) at peak power; r = 1 without it, which only a naturally aspirated engine may leave out. */
  boost: number | null;
  boostUnit: BoostUnit;
};

export type R85Options = {
  aspiration: EngineAspiration;
  /** f_m the owner picked (0.3…1.2), used when q_c cannot be computed from the run. */
  chosenEngineFactor?: number | null;
  /** The run's figures for q_c; null or missing pieces mean f_m is chosen. */
  run?: EngineFactorRunInput | null;
};

function missingForQc(
  run: EngineFactorRunInput | null | undefined,
  aspiration: EngineAspiration,
  barometricKpa: number,
) {
  if (!run) return 'the run’s figures were not given';
  const missing: string[] = [];
  if (!(run.power != null && run.power > 0)) missing.push('the measured peak power');
  if (!(run.rpm != null && run.rpm > 0)) missing.push('the rpm at peak power');
  if (!(run.bsfc != null && run.bsfc > 0)) missing.push('a brake specific fuel consumption');
  if (!(run.displacementL != null && run.displacementL > 0)) {
    missing.push('the engine displacement');
  }
  if (aspiration === 'turbocharged' && run.boost == null) missing.push('the boost at peak power');
  if (
    run.boost != null &&
    !(barometricKpa + convertPressure(run.boost, run.boostUnit, 'kpa') > 0)
  ) {
    missing.push('a boost above a full vacuum');
  }
  if (
    run.basis === 'wheel' &&
    !(run.drivetrainLossPct != null && run.drivetrainLossPct >= 0 && run.drivetrainLossPct < 100)
  ) {
    missing.push('the drivetrain loss (to take wheel power back to the crank)');
  }
  return missing.length ? `it needs ${missing.join(', ')}` : null;
}

function engineFactorLine(qc: number): { expression: string; value: number } {
  const value = r85EngineFactor(qc);
  const branch = engineFactorBranch(qc);
  if (branch === 'below') return { expression: `q_c = ${fmt(qc)} < 37.2, so f_m = 0.3`, value };
  if (branch === 'above') return { expression: `q_c = ${fmt(qc)} > 65, so f_m = 1.2`, value };
  return { expression: `f_m = 0.036 × ${fmt(qc)} − 1.14 = ${fmt(value)}`, value };
}

/**
 * R85's engine factor f_m for a run: from q_c when the run, the build and the
 * assumptions give what it needs (fuel flow = measured crank power × BSFC),
 * otherwise the owner's chosen f_m, otherwise {@link DEFAULT_ENGINE_FACTOR}.
 * `barometricKpa` is the total barometric pressure, the denominator of the
 * boost pressure ratio r.
 */
export function r85EngineFactorForRun(opts: R85Options, barometricKpa: number): EngineFactorResult {
  const { aspiration, chosenEngineFactor, run } = opts;
  if (chosenEngineFactor != null) {
    assertFinite('chosenEngineFactor', chosenEngineFactor);
    if (
      chosenEngineFactor < engineFactorLimits.min ||
      chosenEngineFactor > engineFactorLimits.max
    ) {
      throw new RangeError(
        `chosenEngineFactor must be between ${engineFactorLimits.min} and ${engineFactorLimits.max} (got ${chosenEngineFactor})`,
      );
    }
  }
  const reason = missingForQc(run, aspiration, barometricKpa);
  if (reason !== null || !run) {
    const chosen = chosenEngineFactor != null;
    const value = chosen ? chosenEngineFactor : DEFAULT_ENGINE_FACTOR;
    const because = `f_m was not computed from the run: ${reason}`;
    return {
      value,
      source: chosen ? 'chosen' : 'default',
      qc: null,
      reason: because,
      working: working(
        chosen
          ? 'f_m as chosen (0.3 ≤ f_m ≤ 1.2)'
          : 'f_m = 0.3, the standard’s lowest (none chosen)',
        chosen
          ? [
              {
                name: 'Engine factor f_m',
                value,
                unit: 'ratio',
                from: 'choice',
                ref: 'engineFactor',
              },
            ]
          : [],
        chosen ? [] : [C.r85FmFloor],
        [step('Engine factor', `${because}; f_m = ${fmt(value)}`, value, 'ratio')],
      ),
    };
  }
  const power = run.power!;
  const rpm = run.rpm!;
  const bsfc = run.bsfc!;
  const displacementL = run.displacementL!;
  const inputs: DynoWorkingInput[] = [
    {
      name: 'Measured peak power',
      value: power,
      unit: run.powerUnit,
      from: 'run',
      ref: 'peakPower',
    },
    { name: 'rpm at peak power', value: rpm, unit: 'rpm', from: 'run', ref: 'peakPowerRpm' },
    {
      name: 'Brake specific fuel consumption',
      value: bsfc,
      unit: run.bsfcUnit,
      from: 'assumption',
      ref: 'bsfc',
    },
    {
      name: 'Displacement',
      value: displacementL,
      unit: 'l',
      from: 'build',
      ref: 'displacementLiters',
    },
    {
      name: 'Barometric pressure',
      value: barometricKpa,
      unit: 'kpa',
      from: 'weather',
      ref: 'pressure',
    },
  ];
  const steps: DynoStep[] = [];
  let crankKw = convertPower(power, run.powerUnit, 'kw');
  if (run.powerUnit !== 'kw') {
    steps.push(
      step(
        'Measured power in kW',
        `${withUnit(power, run.powerUnit)} = ${withUnit(crankKw, 'kw')}`,
        crankKw,
        'kw',
      ),
    );
  }
  if (run.basis === 'wheel') {
    const loss = run.drivetrainLossPct!;
    inputs.push({
      name: 'Drivetrain loss',
      value: loss,
      unit: '%',
      from: 'assumption',
      ref: 'drivetrainLossPct',
    });
    const wheelKw = crankKw;
    crankKw = wheelKw / (1 - loss / 100);
    steps.push(
      step(
        'Crank power (wheel power ÷ (1 − loss))',
        `${fmt(wheelKw)} ÷ (1 − ${fmt(loss)} %) = ${withUnit(crankKw, 'kw')}`,
        crankKw,
        'kw',
      ),
    );
  }
  const bsfcGPerKwh = convertBsfc(bsfc, run.bsfcUnit, 'g-per-kwh');
  if (run.bsfcUnit !== 'g-per-kwh') {
    steps.push(
      step(
        'BSFC in g/kWh',
        `${withUnit(bsfc, run.bsfcUnit)} = ${withUnit(bsfcGPerKwh, 'g-per-kwh')}`,
        bsfcGPerKwh,
        'g-per-kwh',
      ),
    );
  }
  const fuelGPerS = (crankKw * bsfcGPerKwh) / 3600;
  steps.push(
    step(
      'Fuel flow',
      `fuel = ${fmt(crankKw)} kW × ${fmt(bsfcGPerKwh)} g/kWh ÷ 3600 = ${withUnit(fuelGPerS, 'g-per-s')}`,
      fuelGPerS,
      'g-per-s',
    ),
  );
  const q = fuelDeliveryParameter(fuelGPerS, displacementL, rpm);
  steps.push(
    step(
      'Fuel delivery per litre and cycle',
      `q = 120000 × ${fmt(fuelGPerS)} ÷ (${fmt(displacementL)} × ${fmt(rpm)}) = ${withUnit(q, 'mg-per-l-cycle')}`,
      q,
      'mg-per-l-cycle',
    ),
  );
  let r = 1;
  if (run.boost != null) {
    const boostKpa = convertPressure(run.boost!, run.boostUnit, 'kpa');
    inputs.push({
      name: 'Boost at peak power',
      value: run.boost!,
      unit: run.boostUnit,
      from: 'run',
      ref: 'boost',
    });
    r = (barometricKpa + boostKpa) / barometricKpa;
    steps.push(
      step(
        'Boost pressure ratio',
        `r = (${withUnit(barometricKpa, 'kpa')} + ${withUnit(boostKpa, 'kpa')} boost) ÷ ${withUnit(barometricKpa, 'kpa')} = ${fmt(r)}`,
        r,
        'ratio',
      ),
    );
  } else {
    steps.push(step('Boost pressure ratio', 'r = 1 (no boost)', r, 'ratio'));
  }
  const qc = q / r;
  steps.push(
    step(
      'Corrected fuel delivery',
      `q_c = ${fmt(q)} ÷ ${fmt(r)} = ${withUnit(qc, 'mg-per-l-cycle')}`,
      qc,
      'mg-per-l-cycle',
    ),
  );
  const line = engineFactorLine(qc);
  steps.push(step('Engine factor', line.expression, line.value, 'ratio'));
  return {
    value: line.value,
    source: 'computed',
    qc,
    reason: null,
    working: working(
      'f_m = 0.036 q_c − 1.14 (37.2 ≤ q_c ≤ 65), 0.3 below, 1.2 above; q_c = q/r; q = 120000 × fuel[g/s] ÷ (D[L] × rpm); fuel = crank kW × BSFC ÷ 3600',
      inputs,
      [
        C.fuelDelivery,
        C.r85FmSlope,
        C.r85FmIntercept,
        C.r85QcLow,
        C.r85QcHigh,
        C.r85FmFloor,
        C.r85FmCeiling,
      ],
      steps,
    ),
  };
}

// ---------------------------------------------------------------- with the working

/** What a correction is computed from. */
export type CorrectionRequest = {
  standard: CorrectionStandard;
  /** The run's weather, or the session's; null when neither recorded any. */
  weather: Weather | null;
  /** UN ECE R85 only: aspiration and the engine factor. Turbocharged, f_m by default, when absent. */
  r85?: R85Options;
};

const noHumidityWarning: CorrectionWarning = {
  code: 'no-humidity',
  message:
    'No humidity was recorded, so the air is taken as dry: the factor comes out a little lower than it would with the humidity known.',
};

function uncorrected(): CorrectionResult {
  return {
    standard: 'uncorrected',
    label: correctionStandardLabels.uncorrected,
    factor: 1,
    applied: true,
    valid: true,
    message: null,
    warnings: [],
    engineFactor: null,
    working: working('factor = 1 (figures as measured)', [], [], []),
  };
}

function notApplied(standard: CorrectionStandard): CorrectionResult {
  const label = correctionStandardLabels[standard];
  const message = `No weather was recorded for this run or its session, so it cannot be corrected to ${label}; the figures are as measured.`;
  return {
    standard,
    label,
    factor: 1,
    applied: false,
    valid: true,
    message,
    warnings: [{ code: 'no-weather', message }],
    engineFactor: null,
    working: working('factor = 1 (no weather recorded: figures as measured)', [], [], []),
  };
}

function kelvinStep(a: Ambient): DynoStep {
  const kelvin = a.temperatureC + C.celsiusToKelvin.value;
  return step(
    'Air temperature in K',
    `T = ${fmt(a.temperatureC)} + 273 = ${withUnit(kelvin, 'k')}`,
    kelvin,
    'k',
  );
}

function sae1349(w: Weather): CorrectionResult {
  const a = ambientFromWeather(w);
  const factor = sae1349Factor(a.temperatureC, a.dryPressureKpa);
  const kelvin = a.temperatureC + C.celsiusToKelvin.value;
  const steps = [
    ...a.steps,
    kelvinStep(a),
    step(
      'Correction factor',
      `CF = 1.18 × (99 ÷ ${fmt(a.dryPressureKpa)}) × √(${fmt(kelvin)} ÷ 298) − 0.18 = ${fmt(factor)}`,
      factor,
      'factor',
    ),
  ];
  return {
    standard: 'sae-j1349',
    label: correctionStandardLabels['sae-j1349'],
    factor,
    applied: true,
    valid: true,
    message: null,
    warnings: a.humidity === 'none' ? [noHumidityWarning] : [],
    engineFactor: null,
    working: working(
      'CF = 1.18 × (99 / p_d) × √((t + 273) / 298) − 0.18   (p_d dry-air pressure in kPa, t in °C)',
      a.inputs,
      [
        C.j1349Multiplier,
        C.j1349Pressure,
        C.celsiusToKelvin,
        C.j1349Temperature,
        C.j1349Offset,
        ...a.constants,
      ],
      steps,
    ),
  };
}

function r85(w: Weather, opts: R85Options): CorrectionResult {
  const a = ambientFromWeather(w);
  const fa = r85AtmosphericFactor(a.temperatureC, a.dryPressureKpa, opts.aspiration);
  const kelvin = a.temperatureC + C.celsiusToKelvin.value;
  const turbo = opts.aspiration === 'turbocharged';
  const fm = r85EngineFactorForRun(opts, a.pressureKpa);
  const factor = r85Factor(fa, fm.value);
  const valid = r85FactorValid(factor);
  const warnings: CorrectionWarning[] = a.humidity === 'none' ? [noHumidityWarning] : [];
  if (fm.source === 'chosen') {
    warnings.push({
      code: 'engine-factor-chosen',
      message: `The engine factor f_m = ${fmt(fm.value)} is the one chosen: ${fm.reason}.`,
    });
  } else if (fm.source === 'default') {
    warnings.push({
      code: 'engine-factor-default',
      message: `The engine factor f_m = ${fmt(fm.value)}, the standard’s lowest, is used because none was chosen and ${fm.reason}.`,
    });
  }
  const message = valid
    ? null
    : `α_d = ${fmt(factor)} is outside the 0.9 to 1.1 range UN ECE R85 allows, so this corrected figure is outside the standard's range.`;
  if (message) warnings.push({ code: 'outside-valid-range', message });
  const steps = [
    ...a.steps,
    kelvinStep(a),
    step(
      turbo ? 'Atmospheric factor (turbocharged)' : 'Atmospheric factor (naturally aspirated)',
      turbo
        ? `f_a = (99 ÷ ${fmt(a.dryPressureKpa)})^0.7 × (${fmt(kelvin)} ÷ 298)^1.5 = ${fmt(fa)}`
        : `f_a = (99 ÷ ${fmt(a.dryPressureKpa)}) × (${fmt(kelvin)} ÷ 298)^0.7 = ${fmt(fa)}`,
      fa,
      'factor',
    ),
    ...fm.working.steps,
    step(
      'Correction factor',
      `α_d = ${fmt(fa)}^${fmt(fm.value)} = ${fmt(factor)}`,
      factor,
      'factor',
    ),
  ];
  return {
    standard: 'ece-r85',
    label: correctionStandardLabels['ece-r85'],
    factor,
    applied: true,
    valid,
    message,
    warnings,
    engineFactor: fm,
    working: working(
      turbo
        ? 'α_d = f_a^f_m, f_a = (99 / p_s)^0.7 × (T / 298)^1.5   (p_s dry-air pressure in kPa, T = t + 273 K); valid for 0.9 ≤ α_d ≤ 1.1'
        : 'α_d = f_a^f_m, f_a = (99 / p_s) × (T / 298)^0.7   (p_s dry-air pressure in kPa, T = t + 273 K); valid for 0.9 ≤ α_d ≤ 1.1',
      [...a.inputs, ...fm.working.inputs.filter((i) => i.from !== 'weather')],
      [
        C.r85Pressure,
        C.celsiusToKelvin,
        C.r85Temperature,
        turbo ? C.r85TurboPressureExponent : C.r85NaPressureExponent,
        turbo ? C.r85TurboTemperatureExponent : C.r85NaTemperatureExponent,
        C.r85ValidLow,
        C.r85ValidHigh,
        ...fm.working.constants,
        ...a.constants,
      ],
      steps,
    ),
  };
}

function sae607(w: Weather): CorrectionResult {
  const a = ambientFromWeather(w);
  const tempF = convertTemperature(w.temperature, w.temperatureUnit, 'f');
  const inHg = convertPressure(a.pressureKpa, 'kpa', 'inhg');
  const factor = sae607Factor(tempF, inHg);
  const steps: DynoStep[] = [];
  if (w.temperatureUnit !== 'f') {
    steps.push(
      step(
        'Air temperature in °F',
        `t = ${fmt(a.temperatureC)} × 1.8 + 32 = ${withUnit(tempF, 'f')}`,
        tempF,
        'f',
      ),
    );
  }
  if (w.pressureUnit !== 'inhg') {
    steps.push(
      step(
        'Barometric pressure in inHg',
        `P = ${withUnit(w.pressure, w.pressureUnit)} = ${withUnit(inHg, 'inhg')}`,
        inHg,
        'inhg',
      ),
    );
  }
  steps.push(
    step(
      'Correction factor',
      `CF = (29.92 ÷ ${fmt(inHg)}) × √((${fmt(tempF)} + 460) ÷ 520) = ${fmt(factor)}`,
      factor,
      'factor',
    ),
  );
  return {
    standard: 'sae-j607',
    label: correctionStandardLabels['sae-j607'],
    factor,
    applied: true,
    valid: true,
    message: null,
    warnings: [],
    engineFactor: null,
    working: working(
      'CF = (29.92 / P) × √((t + 460) / 520)   (P total barometric pressure in inHg, t in °F; humidity not used, as published)',
      a.inputs.filter((i) => i.ref === 'temperature' || i.ref === 'pressure'),
      [C.j607Pressure, C.j607Rankine, C.j607Temperature],
      steps,
    ),
  };
}

function din70020(w: Weather): CorrectionResult {
  const a = ambientFromWeather(w);
  const mbar = convertPressure(a.pressureKpa, 'kpa', 'mbar');
  const factor = din70020Factor(a.temperatureC, mbar);
  const steps: DynoStep[] = a.steps.filter((s) => s.unit === 'c');
  if (w.pressureUnit !== 'mbar') {
    steps.push(
      step(
        'Barometric pressure in mbar',
        `p = ${withUnit(w.pressure, w.pressureUnit)} = ${withUnit(mbar, 'mbar')}`,
        mbar,
        'mbar',
      ),
    );
  }
  steps.push(
    step(
      'Correction factor',
      `CF = (1013 ÷ ${fmt(mbar)}) × √((273 + ${fmt(a.temperatureC)}) ÷ 293) = ${fmt(factor)}`,
      factor,
      'factor',
    ),
  );
  return {
    standard: 'din-70020',
    label: correctionStandardLabels['din-70020'],
    factor,
    applied: true,
    valid: true,
    message: null,
    warnings: [],
    engineFactor: null,
    working: working(
      'CF = (1013 / p) × √((273 + t) / 293)   (p total barometric pressure in mbar, t in °C; humidity not used, as published)',
      a.inputs.filter((i) => i.ref === 'temperature' || i.ref === 'pressure'),
      [C.dinPressure, C.dinKelvin, C.dinTemperature],
      steps,
    ),
  };
}

/**
 * The correction factor of a standard for a run's weather, with its working.
 * Without weather (and for `uncorrected`) the factor is 1; `applied` says
 * which. R85 without options takes a turbocharged engine and the default f_m.
 */
export function correctionFactor(req: CorrectionRequest): CorrectionResult {
  if (req.standard === 'uncorrected') return uncorrected();
  if (!req.weather) return notApplied(req.standard);
  switch (req.standard) {
    case 'sae-j1349':
      return sae1349(req.weather);
    case 'ece-r85':
      return r85(req.weather, req.r85 ?? { aspiration: 'turbocharged' });
    case 'sae-j607':
      return sae607(req.weather);
    case 'din-70020':
      return din70020(req.weather);
  }
}
