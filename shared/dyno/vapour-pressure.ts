/**
 * Water vapour in the air at a dyno, and the dry-air pressure the SAE J1349
 * and UN ECE R85 corrections use.
 *
 * Saturation vapour pressure over liquid water by Buck's equation:
 *
 *   e_s(t) = 0.61121 × exp((18.678 − t/234.5) × t / (257.14 + t))  kPa, t in °C
 *
 * Buck, A. L. (1981), "New equations for computing vapor pressure and
 * enhancement factor", J. Appl. Meteor. 20, 1527–1532, with the coefficients
 * as Buck revised them (Buck Research CR-1A User's Manual, 1996, Appendix 1)
 * [memory: the 1981 paper prints 18.729, 227.3 and 257.87 for the same form].
 * Against the CRC Handbook of Chemistry and Physics table "Vapor Pressure of
 * Water" it agrees within 0.05 % from 0 to 50 °C.
 *
 * Why this and not the WMO's Magnus form (WMO-No. 8, Annex 4.B,
 * 6.112 exp(17.62 t / (243.12 + t)) hPa): Buck's is the closer of the two to
 * the tables over a dyno's temperatures, and is what reference.md names.
 *
 * Vapour pressure from the humidity a weather record gives:
 * - relative humidity: p_v = RH/100 × e_s(t);
 * - dew point: p_v = e_s(t_d) (the dew point is over water by definition,
 *   WMO-No. 8, so the water equation is right below 0 °C too).
 * The enhancement factor (about 1.004 in moist air at 1000 mbar, Buck 1981)
 * is not applied: it moves p_v by 0.4 % of itself, which moves a correction
 * factor by about 0.01 %, and the published correction formulas do not use it.
 *
 * Dry-air pressure p_d = p − p_v (Dalton's law of partial pressures).
 */
import { convertPressure, convertTemperature } from '@shared/units/convert';
import type {
  DynoFigure,
  DynoStep,
  DynoWorkingInput,
  Weather,
  WorkingConstant,
} from '@shared/schemas/dyno';
import { assertFinite, dynoFigure, fmt, step, withUnit, working } from './working';

/** Coefficients of Buck's equation (see the module note for the source). */
export const BUCK_COEFFICIENTS = { a: 0.61121, b: 18.678, c: 234.5, d: 257.14 } as const;

export const buckSource =
  'Buck, A. L. (1981), "New equations for computing vapor pressure and enhancement factor", J. Appl. Meteor. 20, 1527–1532; coefficients as revised in Buck Research CR-1A User\'s Manual (1996), Appendix 1 [memory]';

export const buckConstants: WorkingConstant[] = [
  { name: 'Buck a', value: BUCK_COEFFICIENTS.a, unit: 'kpa', source: buckSource },
  { name: 'Buck b', value: BUCK_COEFFICIENTS.b, unit: 'ratio', source: buckSource },
  { name: 'Buck c', value: BUCK_COEFFICIENTS.c, unit: 'c', source: buckSource },
  { name: 'Buck d', value: BUCK_COEFFICIENTS.d, unit: 'c', source: buckSource },
];

/** Saturation vapour pressure over liquid water, kPa, at t °C (Buck; see the module note). */
export function saturationVapourPressureKpa(tempC: number): number {
  const { a, b, c, d } = BUCK_COEFFICIENTS;
  return a * Math.exp((b - tempC / c) * (tempC / (d + tempC)));
}

/** How the weather record gave its humidity. */
export type HumidityGiven = 'relative-humidity' | 'dew-point' | 'none';

/** The weather in the units the formulas use, with the steps that got there. */
export type Ambient = {
  temperatureC: number;
  pressureKpa: number;
  /** Water vapour pressure, kPa; 0 when no humidity was recorded. */
  vapourPressureKpa: number;
  /** p − p_v, kPa; the whole barometric pressure when no humidity was recorded. */
  dryPressureKpa: number;
  humidity: HumidityGiven;
  inputs: DynoWorkingInput[];
  constants: WorkingConstant[];
  steps: DynoStep[];
};

/** The weather record's own values as working inputs. */
export function weatherInputs(w: Weather): DynoWorkingInput[] {
  const inputs: DynoWorkingInput[] = [
    {
      name: 'Air temperature',
      value: w.temperature,
      unit: w.temperatureUnit,
      from: 'weather',
      ref: 'temperature',
    },
    {
      name: 'Barometric pressure',
      value: w.pressure,
      unit: w.pressureUnit,
      from: 'weather',
      ref: 'pressure',
    },
  ];
  if (w.relativeHumidityPct != null) {
    inputs.push({
      name: 'Relative humidity',
      value: w.relativeHumidityPct,
      unit: '%',
      from: 'weather',
      ref: 'relativeHumidityPct',
    });
  } else if (w.dewPoint != null) {
    inputs.push({
      name: 'Dew point',
      value: w.dewPoint,
      unit: w.temperatureUnit,
      from: 'weather',
      ref: 'dewPoint',
    });
  }
  return inputs;
}

/**
 * Temperature in °C, pressure in kPa, vapour pressure and dry-air pressure of
 * a weather record, each conversion as a step. Values the schema would refuse
 * still compute; a non-finite one throws a RangeError.
 */
export function ambientFromWeather(w: Weather): Ambient {
  assertFinite('weather.temperature', w.temperature);
  assertFinite('weather.pressure', w.pressure, { positive: true });
  const steps: DynoStep[] = [];
  const temperatureC = convertTemperature(w.temperature, w.temperatureUnit, 'c');
  if (w.temperatureUnit !== 'c') {
    steps.push(
      step(
        'Air temperature in °C',
        `t = (${fmt(w.temperature)} °F − 32) ÷ 1.8 = ${withUnit(temperatureC, 'c')}`,
        temperatureC,
        'c',
      ),
    );
  }
  const pressureKpa = convertPressure(w.pressure, w.pressureUnit, 'kpa');
  if (w.pressureUnit !== 'kpa') {
    const factor = convertPressure(1, w.pressureUnit, 'kpa');
    steps.push(
      step(
        'Barometric pressure in kPa',
        `p = ${withUnit(w.pressure, w.pressureUnit)} × ${fmt(factor)} = ${withUnit(pressureKpa, 'kpa')}`,
        pressureKpa,
        'kpa',
      ),
    );
  }
  const constants: WorkingConstant[] = [];
  let vapourPressureKpa = 0;
  let humidity: HumidityGiven = 'none';
  if (w.relativeHumidityPct != null) {
    humidity = 'relative-humidity';
    const es = saturationVapourPressureKpa(temperatureC);
    vapourPressureKpa = (w.relativeHumidityPct / 100) * es;
    steps.push(
      step(
        'Saturation vapour pressure at the air temperature (Buck)',
        `e_s = 0.61121 × exp((18.678 − ${fmt(temperatureC)}/234.5) × ${fmt(temperatureC)}/(257.14 + ${fmt(temperatureC)})) = ${withUnit(es, 'kpa')}`,
        es,
        'kpa',
      ),
      step(
        'Water vapour pressure',
        `p_v = ${fmt(w.relativeHumidityPct)} % ÷ 100 × ${fmt(es)} = ${withUnit(vapourPressureKpa, 'kpa')}`,
        vapourPressureKpa,
        'kpa',
      ),
    );
    constants.push(...buckConstants);
  } else if (w.dewPoint != null) {
    humidity = 'dew-point';
    const dewC = convertTemperature(w.dewPoint, w.temperatureUnit, 'c');
    if (w.temperatureUnit !== 'c') {
      steps.push(
        step(
          'Dew point in °C',
          `t_d = (${fmt(w.dewPoint)} °F − 32) ÷ 1.8 = ${withUnit(dewC, 'c')}`,
          dewC,
          'c',
        ),
      );
    }
    vapourPressureKpa = saturationVapourPressureKpa(dewC);
    steps.push(
      step(
        'Water vapour pressure = saturation vapour pressure at the dew point (Buck)',
        `p_v = 0.61121 × exp((18.678 − ${fmt(dewC)}/234.5) × ${fmt(dewC)}/(257.14 + ${fmt(dewC)})) = ${withUnit(vapourPressureKpa, 'kpa')}`,
        vapourPressureKpa,
        'kpa',
      ),
    );
    constants.push(...buckConstants);
  }
  const dryPressureKpa = pressureKpa - vapourPressureKpa;
  if (humidity !== 'none') {
    steps.push(
      step(
        'Dry-air pressure',
        `p_d = ${fmt(pressureKpa)} − ${fmt(vapourPressureKpa)} = ${withUnit(dryPressureKpa, 'kpa')}`,
        dryPressureKpa,
        'kpa',
      ),
    );
  }
  return {
    temperatureC,
    pressureKpa,
    vapourPressureKpa,
    dryPressureKpa,
    humidity,
    inputs: weatherInputs(w),
    constants,
    steps,
  };
}

/** The water vapour pressure of a weather record as a figure with its working (0 kPa without humidity). */
export function vapourPressure(w: Weather): DynoFigure {
  const a = ambientFromWeather(w);
  const formula =
    a.humidity === 'relative-humidity'
      ? 'p_v = RH/100 × e_s(t), e_s(t) = 0.61121 × exp((18.678 − t/234.5) × t/(257.14 + t)) kPa'
      : a.humidity === 'dew-point'
        ? 'p_v = e_s(t_d) = 0.61121 × exp((18.678 − t_d/234.5) × t_d/(257.14 + t_d)) kPa'
        : 'no humidity recorded: p_v taken as 0 kPa (dry air)';
  return dynoFigure(
    'Water vapour pressure',
    a.vapourPressureKpa,
    'kpa',
    working(formula, a.inputs, a.constants, a.steps),
  );
}

/** Dry-air pressure p_d = p − p_v of a weather record as a figure with its working. */
export function dryAirPressure(w: Weather): DynoFigure {
  const a = ambientFromWeather(w);
  return dynoFigure(
    'Dry-air pressure',
    a.dryPressureKpa,
    'kpa',
    working(
      a.humidity === 'none'
        ? 'p_d = p (no humidity recorded: the air is taken as dry)'
        : 'p_d = p − p_v (Dalton’s law of partial pressures)',
      a.inputs,
      a.constants,
      a.steps,
    ),
  );
}
