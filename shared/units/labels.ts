/**
 * How Headroom writes each unit, in US English: the one map of unit labels. Typed views of it
 * (torque, power, pressure…) come from labelsOf; a picker that needs longer words for one unit
 * ("PS (metric hp)", "mbar (hPa)") starts from it and says only what differs.
 */
export const unitLabels = {
  // torque
  'lbf-ft': 'lbf·ft',
  'lbf-in': 'lbf·in',
  'n-m': 'N·m',
  // power
  hp: 'hp',
  'hp-crank': 'crank hp',
  'hp-wheel': 'wheel hp',
  kw: 'kW',
  w: 'W',
  ps: 'PS',
  // pressure
  kpa: 'kPa',
  pa: 'Pa',
  mpa: 'MPa',
  bar: 'bar',
  mbar: 'mbar',
  psi: 'psi',
  inhg: 'inHg',
  // temperature
  c: '°C',
  f: '°F',
  k: 'K',
  r: '°R',
  // mass and volume flow, volume, fuel use, density
  'kg-per-s': 'kg/s',
  'kg-per-h': 'kg/h',
  'g-per-s': 'g/s',
  'lb-per-min': 'lb/min',
  'lb-per-h': 'lb/h',
  l: 'L',
  'l-per-h': 'L/h',
  'l-per-min': 'L/min',
  'gal-per-h': 'US gal/h',
  'ml-per-min': 'ml/min',
  'mm3-per-stroke': 'mm³/stroke',
  'ml-per-1000-strokes': 'ml/1000 strokes',
  'lb-per-hp-h': 'lb/(hp·h)',
  'g-per-kwh': 'g/kWh',
  'kg-per-l': 'kg/L',
  // speed
  rpm: 'rpm',
} as const;

export type LabelledUnit = keyof typeof unitLabels;

/** The labels of some units, as a map typed by them: `labelsOf(torqueUnits)`. */
export function labelsOf<U extends LabelledUnit>(units: readonly U[]): Record<U, string> {
  const out = {} as Record<U, string>;
  for (const u of units) out[u] = unitLabels[u];
  return out;
}
