import { formatNumber } from '@shared/format';
import { dynoUnitLabels } from '@shared/dyno/working';
import {
  type DynoPowerUnit,
  type DynoTorqueUnit,
  type PowerBasis,
  type WeatherFields,
} from '@shared/schemas/dyno';
import {
  convertPower,
  convertPressure,
  convertTemperature,
  convertTorque,
} from '@shared/units/convert';

/** Power for reading: hp first, and the run's own unit after it when that is another. */
export function powerText(value: number, unit: DynoPowerUnit, basis?: PowerBasis): string {
  const hp = convertPower(value, unit, 'hp');
  const main = `${formatNumber(hp, 1)} ${basis ? `${basis} hp` : 'hp'}`;
  return unit === 'hp' ? main : `${main} (${formatNumber(value, 1)} ${dynoUnitLabels[unit]})`;
}

/** Torque for reading: lbf·ft first, and N·m after it when the run was in N·m. */
export function torqueText(value: number, unit: DynoTorqueUnit): string {
  const lbft = convertTorque(value, unit, 'lbf-ft');
  const main = `${formatNumber(lbft, 1)} lbf·ft`;
  return unit === 'lbf-ft' ? main : `${main} (${formatNumber(value, 0)} N·m)`;
}

export const rpmText = (rpm: number) => `${formatNumber(rpm, 0)} rpm`;

/** A correction factor: four decimals are what changes between standards. */
export const factorText = (factor: number) => formatNumber(factor, 4);

/** A working value with its unit label ("97 kPa", "1.0344"). */
export function valueText(value: number, unit: string, digits = 4): string {
  const n = formatNumber(value, digits);
  if (unit === 'factor') return n;
  if (unit === 'ratio') return n;
  return `${n} ${dynoUnitLabels[unit] ?? unit}`;
}

/** Weather in a line: both temperature scales and the pressure as typed, with kPa beside it. */
export function weatherText(w: WeatherFields): string {
  const c = convertTemperature(w.temperature, w.temperatureUnit, 'c');
  const f = convertTemperature(w.temperature, w.temperatureUnit, 'f');
  const temp =
    w.temperatureUnit === 'f'
      ? `${formatNumber(f, 1)} °F (${formatNumber(c, 1)} °C)`
      : `${formatNumber(c, 1)} °C (${formatNumber(f, 1)} °F)`;
  const kpa = convertPressure(w.pressure, w.pressureUnit, 'kpa');
  const pressure =
    w.pressureUnit === 'kpa'
      ? `${formatNumber(kpa, 2)} kPa`
      : `${formatNumber(w.pressure, 2)} ${dynoUnitLabels[w.pressureUnit]} (${formatNumber(kpa, 2)} kPa)`;
  const humidity =
    w.relativeHumidityPct != null
      ? `${formatNumber(w.relativeHumidityPct, 0)} % relative humidity`
      : w.dewPoint != null
        ? `dew point ${formatNumber(w.dewPoint, 1)} ${dynoUnitLabels[w.temperatureUnit]}`
        : 'no humidity recorded';
  return `${temp} · ${pressure} · ${humidity}`;
}

/** Short names for a kind of dyno, and what it reads. */
export const dynoKindShort = { chassis: 'Chassis dyno', engine: 'Engine dyno' } as const;
export const basisWords = {
  chassis: 'wheel figures (the truck on rollers)',
  engine: 'crank figures (the engine on a brake)',
} as const;

/** Colours of the runs on a chart: Headroom's own palette, told apart by more than hue alone. */
export const runColours = [
  '#b8501d',
  '#2f5d8a',
  '#2e7d4f',
  '#7a4fa0',
  '#a76a0c',
  '#3b465b',
  '#b93226',
  '#1f7a7a',
];

/**
 * Progress toward the target for reading: one decimal, but never rounded up to 100 % before
 * the target is reached (99.96 % reads "99.9 %", not "100 %").
 */
export function progressText(pct: number, reached: boolean): string {
  const shown = reached ? pct : Math.min(pct, 99.9);
  return `${formatNumber(shown, 1)} %`;
}
