/**
 * The estimator's assumptions: each with its default, its allowed range and
 * where the default comes from. One place for every figure the owner can edit,
 * so a citation or a range is corrected once. Sources are those of
 * ../shared/reference.md ("common practice" where no publication fixes a value).
 */
import { LB_PER_HP_H_IN_G_PER_KWH } from '@shared/units/constants';
import { convertBsfc, type BsfcUnit } from '@shared/units/convert';

export type AssumptionSpec = {
  label: string;
  /** Unit id of the value (see figureUnitLabels). */
  unit: string;
  default: number;
  min: number;
  max: number;
  /** Whole numbers only. */
  integer?: boolean;
  /** Where the default (and the range) comes from. */
  source: string;
};

/**
 * Brake specific fuel consumption at peak power, in lb/(hp·h). Default 0.40:
 * about 0.38–0.42 lb/(hp·h) at rated power for a performance diesel (common
 * practice). Range 0.30–0.65: the floor sits a little under the best-point
 * 195 g/kWh (0.32 lb/(hp·h)) of a truck turbodiesel (van Basshuysen & Schäfer,
 * Handbuch Verbrennungsmotor, 3rd ed., 2005); the ceiling allows a rich,
 * smoky tune.
 */
export const bsfcSpec: AssumptionSpec = {
  label: 'Brake specific fuel consumption at peak power',
  unit: 'lb-per-hp-h',
  default: 0.4,
  min: 0.3,
  max: 0.65,
  source:
    'common practice: about 0.38–0.42 lb/(hp·h) at rated power for a performance diesel; best point of a truck turbodiesel 195–225 g/kWh (van Basshuysen & Schäfer, Handbuch Verbrennungsmotor, 3rd ed., 2005)',
};

/** Stoichiometric air–fuel ratio of diesel fuel (CH1.8), 14.5:1. Heywood (1988) ch. 3 [memory]. */
export const STOICHIOMETRIC_AFR_DIESEL = 14.5;
export const stoichiometricAfrSource =
  'Heywood, Internal Combustion Engine Fundamentals (1988), ch. 3: (A/F)s = 34.56(4+y)/(12.011+1.008y) for CH1.8 [memory]';

/** The other assumptions. `cylinders` comes from the build; 8 when the caller gives none. */
export const assumptionSpecs = {
  afr: {
    label: 'Air–fuel ratio at full load',
    unit: 'ratio',
    default: 18,
    min: 12,
    max: 35,
    source:
      'common practice: smoke-limited full-load λ about 1.2–1.4 for a turbodiesel, i.e. about 17.4–20.3:1 against a stoichiometric 14.5:1 (Heywood 1988, ch. 3 [memory])',
  },
  fuelDensityKgPerL: {
    label: 'Fuel density',
    unit: 'kg-per-l',
    default: 0.85,
    min: 0.78,
    max: 0.9,
    source:
      'Chevron, Diesel Fuels Technical Review (2007): US No. 2 diesel typically 0.85 kg/L; EN 590 allows 0.820–0.845 kg/L at 15 °C',
  },
  drivetrainLossPct: {
    label: 'Drivetrain loss',
    unit: '%',
    default: 18,
    min: 0,
    max: 40,
    source: 'common practice: about 15–25 % for an automatic 4WD pickup (no standard exists)',
  },
  peakRpm: {
    label: 'Engine speed at peak power',
    unit: 'rpm',
    default: 3000,
    min: 1000,
    max: 6000,
    integer: true,
    source: 'common practice: pickup diesels make peak power at about 2800–3500 rpm',
  },
  cylinders: {
    label: 'Cylinders',
    unit: 'cylinders',
    default: 8,
    min: 1,
    max: 16,
    integer: true,
    source: 'the build (8 when none is given)',
  },
  tightMarginPct: {
    label: '"Tight" margin',
    unit: '%',
    default: 10,
    min: 0,
    max: 50,
    source: "Headroom's choice: a part with less headroom than this is flagged tight",
  },
} as const satisfies Record<string, AssumptionSpec>;

export type AssumptionKey = keyof typeof assumptionSpecs;

/** The BSFC range in the unit it was entered in, for messages and form hints. */
export function bsfcRange(unit: BsfcUnit): { min: number; max: number } {
  return {
    min: convertBsfc(bsfcSpec.min, 'lb-per-hp-h', unit),
    max: convertBsfc(bsfcSpec.max, 'lb-per-hp-h', unit),
  };
}

/** Whether a BSFC entered in `unit` lies in the allowed range (compared in lb/(hp·h)). */
export function bsfcInRange(value: number, unit: BsfcUnit): boolean {
  const lb = convertBsfc(value, unit, 'lb-per-hp-h');
  // A hair of tolerance so that the range ends typed in g/kWh round-trip.
  const eps = 1e-9;
  return lb >= bsfcSpec.min - eps && lb <= bsfcSpec.max + eps;
}

/** "Between 0.3 and 0.65 lb/(hp·h)" / "Between 182.5 and 395.3 g/kWh" (rounded inward). */
export function bsfcRangeMessage(unit: BsfcUnit): string {
  if (unit === 'lb-per-hp-h') return `Between ${bsfcSpec.min} and ${bsfcSpec.max} lb/(hp·h)`;
  const { min, max } = bsfcRange(unit);
  return `Between ${Math.ceil(min * 10) / 10} and ${Math.floor(max * 10) / 10} g/kWh`;
}

/** The default BSFC (0.40 lb/(hp·h)) in either unit: 243.31 g/kWh. */
export function defaultBsfc(unit: BsfcUnit): number {
  return unit === 'lb-per-hp-h' ? bsfcSpec.default : bsfcSpec.default * LB_PER_HP_H_IN_G_PER_KWH;
}
