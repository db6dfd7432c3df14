/**
 * Unit conversions for the quantities Headroom handles. Every factor is built
 * from the exact definitions in ./constants (NIST SP 811 (2008) B.8/B.9), as a
 * "how many of the SI reference unit in one of this unit" table per quantity;
 * converting is value × factor[from] ÷ factor[to]. Non-finite input gives NaN
 * or ±Infinity back, never an exception: callers validate with zod first.
 */
import {
  FOOT_M,
  HP_W,
  INCH_M,
  INHG_KPA,
  LBF_FT_NM,
  LBF_IN_NM,
  LB_PER_HP_H_IN_G_PER_KWH,
  POUND_KG,
  PSI_KPA,
  PS_W,
  US_GALLON_L,
} from './constants';

function converter<U extends string>(factors: Record<U, number>) {
  return (value: number, from: U, to: U): number => {
    if (from === to) return value;
    return (value * factors[from]) / factors[to];
  };
}

/** Torque units: pound-force foot, pound-force inch, newton metre. */
export const torqueUnits = ['lbf-ft', 'lbf-in', 'n-m'] as const;
export type TorqueUnit = (typeof torqueUnits)[number];
/** N·m in one of each unit. */
const torqueFactors: Record<TorqueUnit, number> = {
  'lbf-ft': LBF_FT_NM,
  'lbf-in': LBF_IN_NM,
  'n-m': 1,
};
/**
 * Converts a torque, e.g. `convertTorque(100, 'lbf-ft', 'n-m')` → 135.58179483314004.
 * lbf·ft = 1.3558179483314004 N·m, lbf·in = 0.11298482902761668 N·m (NIST SP 811 (2008) B.9).
 */
export const convertTorque = converter(torqueFactors);

/** Power units: horsepower (550 ft·lbf/s), kilowatt, watt, metric horsepower (PS). */
export const powerUnits = ['hp', 'kw', 'w', 'ps'] as const;
export type PowerUnit = (typeof powerUnits)[number];
/** W in one of each unit. */
const powerFactors: Record<PowerUnit, number> = { hp: HP_W, kw: 1000, w: 1, ps: PS_W };
/**
 * Converts a power. hp = 745.69987158227 W, PS = 735.49875 W (NIST SP 811 (2008) B.9).
 */
export const convertPower = converter(powerFactors);

/** Mass flow units. */
export const massFlowUnits = ['kg-per-s', 'kg-per-h', 'g-per-s', 'lb-per-min', 'lb-per-h'] as const;
export type MassFlowUnit = (typeof massFlowUnits)[number];
/** kg/s in one of each unit. */
const massFlowFactors: Record<MassFlowUnit, number> = {
  'kg-per-s': 1,
  'kg-per-h': 1 / 3600,
  'g-per-s': 1 / 1000,
  'lb-per-min': POUND_KG / 60,
  'lb-per-h': POUND_KG / 3600,
};
/** Converts a mass flow. lb = 0.45359237 kg exactly (NIST SP 811 (2008) B.8). */
export const convertMassFlow = converter(massFlowFactors);

/** Volume units. */
export const volumeUnits = ['l', 'ml', 'mm3', 'm3', 'us-gal', 'in3'] as const;
export type VolumeUnit = (typeof volumeUnits)[number];
/** L in one of each unit. */
const volumeFactors: Record<VolumeUnit, number> = {
  l: 1,
  ml: 1e-3,
  mm3: 1e-6,
  m3: 1000,
  'us-gal': US_GALLON_L,
  in3: INCH_M * INCH_M * INCH_M * 1000,
};
/** Converts a volume. US gal = 3.785411784 L exactly (NIST SP 811 (2008) B.8). */
export const convertVolume = converter(volumeFactors);

/** Volume flow units (fuel supply ratings, return flow on a bench). */
export const volumeFlowUnits = ['l-per-h', 'gal-per-h', 'l-per-min', 'ml-per-min'] as const;
export type VolumeFlowUnit = (typeof volumeFlowUnits)[number];
/** L/h in one of each unit. */
const volumeFlowFactors: Record<VolumeFlowUnit, number> = {
  'l-per-h': 1,
  'gal-per-h': US_GALLON_L,
  'l-per-min': 60,
  'ml-per-min': 60 / 1000,
};
/** Converts a volume flow; "gal" is the US gallon, 3.785411784 L (NIST SP 811 (2008) B.8). */
export const convertVolumeFlow = converter(volumeFlowFactors);

/** Pressure units (MPa for injection and opening pressures on a flow bench). */
export const pressureUnits = ['kpa', 'pa', 'mpa', 'bar', 'mbar', 'psi', 'inhg'] as const;
export type PressureUnit = (typeof pressureUnits)[number];
/** kPa in one of each unit. */
const pressureFactors: Record<PressureUnit, number> = {
  kpa: 1,
  pa: 1e-3,
  mpa: 1000,
  bar: 100,
  mbar: 0.1,
  psi: PSI_KPA,
  inhg: INHG_KPA,
};
/**
 * Converts a pressure. bar = 100 kPa exactly (NIST SP 811 (2008) B.8); MPa =
 * 1000 kPa (SI prefixes); psi = 6.894757293168361 kPa (NIST SP 811 (2008) B.9);
 * inHg is the conventional inch of mercury, 3.386389 kPa (NIST SP 811 (2008) B.8).
 */
export const convertPressure = converter(pressureFactors);

/** Temperature units: Celsius, Fahrenheit, kelvin. */
export const temperatureUnits = ['c', 'f', 'k'] as const;
export type TemperatureUnit = (typeof temperatureUnits)[number];
/**
 * Converts a temperature (an offset scale, so not a factor table):
 * t[°C] = (t[°F] − 32) / 1.8, T[K] = t[°C] + 273.15 (NIST SP 811 (2008) B.8, 4.2.1.1).
 */
export function convertTemperature(
  value: number,
  from: TemperatureUnit,
  to: TemperatureUnit,
): number {
  if (from === to) return value;
  const celsius = from === 'c' ? value : from === 'f' ? (value - 32) / 1.8 : value - 273.15;
  if (to === 'c') return celsius;
  if (to === 'f') return celsius * 1.8 + 32;
  return celsius + 273.15;
}

/** Brake specific fuel consumption units. */
export const bsfcUnits = ['lb-per-hp-h', 'g-per-kwh'] as const;
export type BsfcUnit = (typeof bsfcUnits)[number];
/** g/kWh in one of each unit. */
const bsfcFactors: Record<BsfcUnit, number> = {
  'lb-per-hp-h': LB_PER_HP_H_IN_G_PER_KWH,
  'g-per-kwh': 1,
};
/**
 * Converts a brake specific fuel consumption. 1 lb/(hp·h) = 608.27739 g/kWh,
 * derived from lb = 0.45359237 kg and hp = 745.69987158227 W (NIST SP 811 (2008) B.8/B.9).
 */
export const convertBsfc = converter(bsfcFactors);

/** Length units, for completeness of the torque and pressure derivations. */
export const lengthUnits = ['m', 'mm', 'ft', 'in'] as const;
export type LengthUnit = (typeof lengthUnits)[number];
const lengthFactors: Record<LengthUnit, number> = { m: 1, mm: 1e-3, ft: FOOT_M, in: INCH_M };
/** Converts a length. ft = 0.3048 m, in = 0.0254 m exactly (NIST SP 811 (2008) B.8). */
export const convertLength = converter(lengthFactors);
