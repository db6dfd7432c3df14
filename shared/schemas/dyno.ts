/**
 * Dyno days (module 7): a session at a dynamometer, the runs (pulls) made
 * there, their curves, the weather they were made in, and the results of
 * correcting them to standard conditions. Types are z.infer of these schemas,
 * never written twice.
 *
 * Runs are stored as measured (uncorrected) in the units the owner typed;
 * corrections are applied on read by shared/dyno.
 *
 * Limits a value is checked against after conversion to one unit (so 140 °F
 * and 60 °C are the same edge): air temperature −60…60 °C, barometric
 * pressure 50…110 kPa, relative humidity 0…100 %. An edge typed in another
 * unit can come back from the conversion a few ulps outside it (−76 °F →
 * −60.000000000000014 °C), so each edge is widened by {@link EDGE_SLACK} of
 * its size before comparing.
 */
import { z } from 'zod';

export {
  DEFAULT_CORRECTION_STANDARD,
  correctionStandardLabels,
  correctionStandards,
  type CorrectionStandard,
} from '@shared/dyno/vocabulary';
import {
  convertPressure,
  convertTemperature,
  type PowerUnit,
  type PressureUnit,
  type TemperatureUnit,
  type TorqueUnit,
} from '@shared/units/convert';
import { labelsOf, unitLabels } from '@shared/units/labels';
import { aspirations, powerBases } from './builds';
import { DEFAULT_CORRECTION_STANDARD, correctionStandards } from '@shared/dyno/vocabulary';
import { idSchema, isoDateSchema, trimmed } from './common';
import { workingConstantSchema } from './estimate';

export { powerBases };
export type PowerBasis = (typeof powerBases)[number];

// ---------------------------------------------------------------- units and kinds

/** Power units a dyno figure may be typed in (a subset of shared/units power units). */
export const dynoPowerUnits = ['hp', 'kw', 'ps'] as const satisfies readonly PowerUnit[];
export type DynoPowerUnit = (typeof dynoPowerUnits)[number];
export const dynoPowerUnitLabels: Record<DynoPowerUnit, string> = {
  ...labelsOf(dynoPowerUnits),
  ps: 'PS (metric hp)',
};

/** Torque units a dyno figure may be typed in. */
export const dynoTorqueUnits = ['lbf-ft', 'n-m'] as const satisfies readonly TorqueUnit[];
export type DynoTorqueUnit = (typeof dynoTorqueUnits)[number];
export const dynoTorqueUnitLabels = labelsOf(dynoTorqueUnits);

/** Boost (gauge pressure above the weather's barometric pressure) units. */
export const boostUnits = ['psi', 'bar', 'kpa'] as const satisfies readonly PressureUnit[];
export type BoostUnit = (typeof boostUnits)[number];
export const boostUnitLabels = labelsOf(boostUnits);

/** Barometric (station) pressure units. */
export const barometerUnits = [
  'kpa',
  'mbar',
  'inhg',
  'psi',
] as const satisfies readonly PressureUnit[];
export type BarometerUnit = (typeof barometerUnits)[number];
export const barometerUnitLabels: Record<BarometerUnit, string> = {
  ...labelsOf(barometerUnits),
  mbar: 'mbar (hPa)',
};

/** Temperature units for the weather and exhaust gas temperature. */
export const dynoTemperatureUnits = ['c', 'f'] as const satisfies readonly TemperatureUnit[];
export type DynoTemperatureUnit = (typeof dynoTemperatureUnits)[number];
export const dynoTemperatureUnitLabels = labelsOf(dynoTemperatureUnits);

/** How a mixture is written: air–fuel ratio by mass, or excess-air ratio λ. */
export const mixtureKinds = ['afr', 'lambda'] as const;
export type MixtureKind = (typeof mixtureKinds)[number];
export const mixtureKindLabels: Record<MixtureKind, string> = {
  afr: 'Air–fuel ratio',
  lambda: 'λ (lambda)',
};

/** What sort of dynamometer: rollers under the tyres, or the engine on a brake. */
export const dynoKinds = ['chassis', 'engine'] as const;
export type DynoKind = (typeof dynoKinds)[number];
export const dynoKindLabels: Record<DynoKind, string> = {
  chassis: 'Chassis dyno — truck on rollers, power at the wheels',
  engine: 'Engine dyno — engine on a brake, power at the crank',
};
/** A chassis dyno measures at the wheels, an engine dyno at the crank. */
export const basisForDynoKind: Record<DynoKind, PowerBasis> = { chassis: 'wheel', engine: 'crank' };

/** A run either went the whole way or was stopped. */
export const runStatuses = ['complete', 'aborted'] as const;
export type RunStatus = (typeof runStatuses)[number];
export const runStatusLabels: Record<RunStatus, string> = {
  complete: 'Complete',
  aborted: 'Stopped early',
};

export const correctionStandardSchema = z.enum(correctionStandards, {
  message: 'Choose a correction standard from the list',
});

/**
 * How the engine breathes, for the R85 atmospheric factor: R85 gives one
 * formula for turbocharged engines (with or without charge-air cooling) and
 * one for naturally aspirated and mechanically supercharged engines [memory].
 */
export const engineAspirations = ['turbocharged', 'naturally-aspirated'] as const;
export type EngineAspiration = (typeof engineAspirations)[number];
export const engineAspirationLabels: Record<EngineAspiration, string> = {
  turbocharged: 'Turbocharged',
  'naturally-aspirated': 'Naturally aspirated or mechanically supercharged',
};
/** A build's aspiration as R85 groups it (see {@link engineAspirations}). */
export const engineAspirationForBuild: Record<(typeof aspirations)[number], EngineAspiration> = {
  'naturally-aspirated': 'naturally-aspirated',
  'single-turbo': 'turbocharged',
  'twin-turbo': 'turbocharged',
  'compound-turbo': 'turbocharged',
  supercharged: 'naturally-aspirated',
};

// ---------------------------------------------------------------- limits

/** Relative slack on a limit's edges, for values converted from another unit. */
export const EDGE_SLACK = 1e-9;

export const weatherLimits = {
  /** Dry-bulb (and dew-point) temperature, °C. */
  temperatureC: { min: -60, max: 60 },
  /** Barometric (station) pressure, kPa. */
  pressureKpa: { min: 50, max: 110 },
  /** Relative humidity, %. */
  humidityPct: { min: 0, max: 100 },
} as const;

/** Engine speed, rev/min: above zero, and at most this. */
export const MAX_RPM = 20_000;
/** Power and torque in any unit: at most this (a sanity bound, not a physical one). */
export const MAX_POWER_OR_TORQUE = 100_000;
/** Boost as gauge pressure, kPa: a vacuum cannot go below −100 kPa; 2000 kPa ≈ 290 psi. */
export const boostLimitsKpa = { min: -100, max: 2000 } as const;
/** Exhaust gas temperature, °C. */
export const egtLimitsC = { min: -60, max: 1400 } as const;
/** Mixture: air–fuel ratio by mass, or λ. */
export const mixtureLimits: Record<MixtureKind, { min: number; max: number }> = {
  afr: { min: 5, max: 200 },
  lambda: { min: 0.3, max: 14 },
};
/** Engine factor f_m of UN ECE R85 / ISO 1585: the standard's own floor and ceiling. */
export const engineFactorLimits = { min: 0.3, max: 1.2 } as const;
/** Curve rows in one run (and in one CSV file). */
export const MAX_CURVE_ROWS = 20_000;
/** A curve CSV file, bytes (UTF-8): 2 MB, as the API's body limit (express.json '2mb'). */
export const MAX_CURVE_CSV_BYTES = 2 * 1024 * 1024;
/** Dates of a session. */
export const dynoDateLimits = { min: '1900-01-01', max: '2100-12-31' } as const;

function within(value: number, min: number, max: number) {
  const slack = EDGE_SLACK * Math.max(Math.abs(min), Math.abs(max), 1);
  return value >= min - slack && value <= max + slack;
}

/**
 * A limit for a message, to two decimals, rounded toward the inside of the
 * range so that the number shown is itself accepted: 50 kPa = 14.7649 inHg
 * shows as a lower limit of 14.77.
 */
function show(x: number, side: 'min' | 'max' = 'min') {
  const scaled = Math.round(x * 100 * 1e6) / 1e6; // drop float noise before ceil/floor
  const inward = side === 'min' ? Math.ceil(scaled) : Math.floor(scaled);
  return String(inward / 100).replace('-', '−');
}

/** "between −60 °C and 60 °C" in the unit the value was typed in. */
function temperatureRangeText(
  limits: { min: number; max: number },
  unit: DynoTemperatureUnit,
): string {
  const lo = convertTemperature(limits.min, 'c', unit);
  const hi = convertTemperature(limits.max, 'c', unit);
  const t = unitLabels[unit];
  return unit === 'c'
    ? `between ${show(lo)} ${t} and ${show(hi, 'max')} ${t}`
    : `between ${show(lo)} ${t} and ${show(hi, 'max')} ${t} (${show(limits.min)} to ${show(limits.max, 'max')} °C)`;
}

function pressureRangeText(limits: { min: number; max: number }, unit: PressureUnit): string {
  const lo = convertPressure(limits.min, 'kpa', unit);
  const hi = convertPressure(limits.max, 'kpa', unit);
  const p = unitLabels[unit];
  return unit === 'kpa'
    ? `between ${show(lo)} and ${show(hi, 'max')} ${p}`
    : `between ${show(lo)} and ${show(hi, 'max')} ${p} (${show(limits.min)} to ${show(limits.max, 'max')} kPa)`;
}

// ---------------------------------------------------------------- field helpers

/** Free text: trimmed, at most `max` characters, and no NUL character (the common text rule). */
export const dynoText = (max: number, label: string) => trimmed(max, label);

/** A finite number (zod rejects NaN and ±Infinity) with a plain message naming the field. */
const numberField = (label: string) => z.number({ message: `${label} must be a number` });

const nonNegative = (label: string) =>
  numberField(label)
    .min(0, { message: `${label} cannot be negative` })
    .max(MAX_POWER_OR_TORQUE, { message: `${label} must be at most ${MAX_POWER_OR_TORQUE}` });

const rpmField = (label: string) =>
  numberField(label)
    .positive({ message: `${label} must be above zero` })
    .max(MAX_RPM, { message: `${label} must be at most ${MAX_RPM}` });

/** A session date, YYYY-MM-DD, from 1900-01-01 to 2100-12-31. */
export const dynoDateSchema = isoDateSchema.refine(
  (d) => d >= dynoDateLimits.min && d <= dynoDateLimits.max,
  { message: 'Use a date from 1900-01-01 to 2100-12-31' },
);

// ---------------------------------------------------------------- weather

const weatherFields = z
  .object({
    /** Dry-bulb air temperature in `temperatureUnit`. */
    temperature: numberField('Temperature'),
    temperatureUnit: z.enum(dynoTemperatureUnits, { message: 'Choose °C or °F' }),
    /** Barometric (station) pressure — as read at the dyno, not corrected to sea level. */
    pressure: numberField('Barometric pressure'),
    pressureUnit: z.enum(barometerUnits, { message: 'Choose kPa, mbar, inHg or psi' }),
    /** Relative humidity in %; give this or a dew point, not both. */
    relativeHumidityPct: numberField('Relative humidity').nullable().optional(),
    /** Dew point in `temperatureUnit`; give this or a relative humidity, not both. */
    dewPoint: numberField('Dew point').nullable().optional(),
  })
  .strict();
export type WeatherFields = z.infer<typeof weatherFields>;

/** Each problem of a weather record, by field, in plain words. */
export function weatherIssues(w: WeatherFields): Record<string, string> {
  const issues: Record<string, string> = {};
  const t = weatherLimits.temperatureC;
  const tempC = convertTemperature(w.temperature, w.temperatureUnit, 'c');
  if (!within(tempC, t.min, t.max)) {
    issues.temperature = `Temperature must be ${temperatureRangeText(t, w.temperatureUnit)}`;
  }
  const p = weatherLimits.pressureKpa;
  const kpa = convertPressure(w.pressure, w.pressureUnit, 'kpa');
  if (!within(kpa, p.min, p.max)) {
    issues.pressure = `Barometric pressure must be ${pressureRangeText(p, w.pressureUnit)}`;
  }
  const h = weatherLimits.humidityPct;
  if (w.relativeHumidityPct != null && !within(w.relativeHumidityPct, h.min, h.max)) {
    issues.relativeHumidityPct = 'Relative humidity must be between 0 and 100 %';
  }
  if (w.dewPoint != null) {
    const dewC = convertTemperature(w.dewPoint, w.temperatureUnit, 'c');
    if (w.relativeHumidityPct != null) {
      issues.dewPoint = 'Give the relative humidity or the dew point, not both';
    } else if (!within(dewC, t.min, t.max)) {
      issues.dewPoint = `Dew point must be ${temperatureRangeText(t, w.temperatureUnit)}`;
    } else if (w.dewPoint > w.temperature) {
      issues.dewPoint = 'The dew point cannot be above the air temperature';
    }
  }
  return issues;
}

function addIssues(ctx: z.RefinementCtx, issues: Record<string, string>) {
  for (const [key, message] of Object.entries(issues)) {
    ctx.addIssue({ code: 'custom', path: [key], message });
  }
}

/**
 * Weather at a session or a run: air temperature, barometric pressure, and
 * humidity as relative humidity or dew point (either may be left out for old
 * records; the corrections that need it then say so).
 */
export const weatherSchema = weatherFields.superRefine((w, ctx) =>
  addIssues(ctx, weatherIssues(w)),
);
export type Weather = z.infer<typeof weatherSchema>;

// ---------------------------------------------------------------- curve rows

/** Units of a run's figures and of its curve columns. */
export const runUnitsSchema = z.object({
  powerUnit: z.enum(dynoPowerUnits, { message: 'Choose hp, kW or PS' }),
  torqueUnit: z.enum(dynoTorqueUnits, { message: 'Choose lbf·ft or N·m' }),
  boostUnit: z.enum(boostUnits, { message: 'Choose psi, bar or kPa' }),
  egtUnit: z.enum(dynoTemperatureUnits, { message: 'Choose °C or °F' }),
  mixtureKind: z.enum(mixtureKinds, { message: 'Choose air–fuel ratio or λ' }),
});
export type RunUnits = z.infer<typeof runUnitsSchema>;

/**
 * One row of a run's curve, in the run's units: rpm, and power and/or torque
 * (the other is computed from P = 2πnT/60), with boost (gauge), exhaust gas
 * temperature and mixture when logged. Missing values are null.
 */
export const curveRowSchema = z
  .object({
    rpm: rpmField('rpm'),
    power: nonNegative('Power').nullable().default(null),
    torque: nonNegative('Torque').nullable().default(null),
    boost: numberField('Boost').nullable().default(null),
    egt: numberField('Exhaust gas temperature').nullable().default(null),
    mixture: numberField('Mixture').nullable().default(null),
  })
  .strict()
  .refine((r) => r.power != null || r.torque != null, {
    message: 'Give power, torque or both',
    path: ['power'],
  });
export type CurveRowInput = z.input<typeof curveRowSchema>;
export type CurveRow = z.output<typeof curveRowSchema>;

type UnitValues = {
  boost?: number | null;
  egt?: number | null;
  mixture?: number | null;
};

/** Range problems of the unit-dependent values (boost, EGT, mixture), by field; a value whose unit is not given is not checked. */
export function unitValueIssues(
  v: UnitValues,
  units: Partial<Pick<RunUnits, 'boostUnit' | 'egtUnit' | 'mixtureKind'>>,
): Record<string, string> {
  const issues: Record<string, string> = {};
  if (v.boost != null && units.boostUnit) {
    const kpa = convertPressure(v.boost, units.boostUnit, 'kpa');
    if (!within(kpa, boostLimitsKpa.min, boostLimitsKpa.max)) {
      issues.boost = `Boost must be ${pressureRangeText(boostLimitsKpa, units.boostUnit)}`;
    }
  }
  if (v.egt != null && units.egtUnit) {
    const c = convertTemperature(v.egt, units.egtUnit, 'c');
    if (!within(c, egtLimitsC.min, egtLimitsC.max)) {
      issues.egt = `Exhaust gas temperature must be ${temperatureRangeText(egtLimitsC, units.egtUnit)}`;
    }
  }
  if (v.mixture != null && units.mixtureKind) {
    const m = mixtureLimits[units.mixtureKind];
    if (!within(v.mixture, m.min, m.max)) {
      issues.mixture =
        units.mixtureKind === 'afr'
          ? `Air–fuel ratio must be between ${m.min} and ${m.max}`
          : `λ must be between ${m.min} and ${m.max}`;
    }
  }
  return issues;
}

export const curveSchema = z
  .array(curveRowSchema)
  .max(MAX_CURVE_ROWS, { message: `A curve has at most ${MAX_CURVE_ROWS} rows` });

// ---------------------------------------------------------------- sessions

const dynoSessionFieldsSchema = z.object({
  date: dynoDateSchema,
  place: dynoText(200, 'Place').optional(),
  dynoKind: z.enum(dynoKinds, { message: 'Choose a chassis dyno or an engine dyno' }),
  runBy: dynoText(120, 'Who ran it').optional(),
  notes: dynoText(4000, 'Notes').optional(),
  /** Weather for every run of the session that has none of its own. */
  weather: weatherSchema.nullable().optional(),
  /**
   * The shop member whose dyno it is: it sees this session and no other. Set
   * by the owner or crew; a shop's own sessions are assigned to it.
   */
  shopUserId: idSchema.nullable().optional(),
});
export type DynoSessionFields = z.infer<typeof dynoSessionFieldsSchema>;

export const createDynoSessionInputSchema = dynoSessionFieldsSchema.strict();
export type CreateDynoSessionInput = z.infer<typeof createDynoSessionInputSchema>;

/** Any subset of the fields; `weather` is replaced whole (null clears it). */
export const updateDynoSessionInputSchema = dynoSessionFieldsSchema
  .partial()
  .strict()
  .refine((v) => Object.keys(v).length > 0, { message: 'Nothing to change' });
export type UpdateDynoSessionInput = z.infer<typeof updateDynoSessionInputSchema>;

// ---------------------------------------------------------------- runs

const dynoRunFieldsSchema = z.object({
  status: z.enum(runStatuses, { message: 'Choose complete or stopped early' }),
  /** Why the run was stopped; required when it was, and only then. */
  abortReason: dynoText(500, 'Reason').nullable().optional(),
  gear: dynoText(40, 'Gear').optional(),
  tuneRevision: dynoText(120, 'Tune revision').optional(),
  notes: dynoText(4000, 'Notes').optional(),
  ...runUnitsSchema.shape,
  /** Peak power as measured (uncorrected), in `powerUnit`, and the rpm it came at. */
  peakPower: nonNegative('Peak power').nullable().optional(),
  peakPowerRpm: rpmField('rpm at peak power').nullable().optional(),
  /** Peak torque as measured (uncorrected), in `torqueUnit`, and the rpm it came at. */
  peakTorque: nonNegative('Peak torque').nullable().optional(),
  peakTorqueRpm: rpmField('rpm at peak torque').nullable().optional(),
  /** Boost (gauge) at peak power, in `boostUnit`. */
  boost: numberField('Boost').nullable().optional(),
  /** Highest exhaust gas temperature of the run, in `egtUnit`. */
  egt: numberField('Exhaust gas temperature').nullable().optional(),
  /** Mixture at peak power, as `mixtureKind`. */
  mixture: numberField('Mixture').nullable().optional(),
  /** The run's own weather; when absent the session's applies. */
  weather: weatherSchema.nullable().optional(),
  /** The measured curve, in the run's units. */
  curve: curveSchema.nullable().optional(),
});
export type DynoRunFields = z.infer<typeof dynoRunFieldsSchema>;

export type DynoIssue = { path: (string | number)[]; message: string };

/**
 * Contradictions in a run: a peak without its rpm, a stopped run without a
 * reason, a complete run with nothing measured, boost/EGT/mixture out of range
 * for their units. With `partial`, an edit is checked alone: a rule runs only
 * when every field it needs is in the edit (the service merges the edit onto
 * the stored run and checks the whole again without `partial`).
 */
export function dynoRunIssues(
  r: Partial<z.input<typeof dynoRunFieldsSchema>>,
  opts: { partial?: boolean } = {},
): DynoIssue[] {
  const issues: DynoIssue[] = [];
  const add = (path: (string | number)[], message: string) => issues.push({ path, message });
  const has = (...keys: (keyof DynoRunFields)[]) => !opts.partial || keys.every((k) => k in r);
  const pair = (value: 'peakPower' | 'peakTorque', rpm: `${typeof value}Rpm`, what: string) => {
    if (!has(value, rpm)) return;
    if (r[value] != null && r[rpm] == null) add([rpm], `Enter the rpm at ${what}`);
    if (r[rpm] != null && r[value] == null) add([value], `Enter the ${what} or clear its rpm`);
  };
  pair('peakPower', 'peakPowerRpm', 'peak power');
  pair('peakTorque', 'peakTorqueRpm', 'peak torque');
  if (has('status', 'abortReason')) {
    if (r.status === 'aborted' && !r.abortReason) {
      add(['abortReason'], 'Say why the run was stopped');
    }
    if (r.status === 'complete' && r.abortReason) {
      add(['abortReason'], 'Only a run that was stopped early has a reason');
    }
  }
  if (has('status', 'peakPower', 'peakTorque', 'curve')) {
    const measured = r.peakPower != null || r.peakTorque != null || (r.curve ?? []).length > 0;
    if (r.status === 'complete' && !measured) {
      add(['peakPower'], 'Enter the peak power, peak torque or a curve of a complete run');
    }
  }
  for (const [key, message] of Object.entries(unitValueIssues(r, r))) add([key], message);
  (r.curve ?? []).forEach((row, i) => {
    for (const [key, message] of Object.entries(unitValueIssues(row, r))) {
      add(['curve', i, key], message);
    }
  });
  return issues;
}

export const createDynoRunInputSchema = dynoRunFieldsSchema.strict().superRefine((r, ctx) => {
  for (const issue of dynoRunIssues(r)) ctx.addIssue({ code: 'custom', ...issue });
});
export type CreateDynoRunInput = z.input<typeof createDynoRunInputSchema>;
export type DynoRunInput = z.output<typeof createDynoRunInputSchema>;

/**
 * Any subset of the fields; `weather` and `curve` are replaced whole (null
 * clears them). Checks what the edit alone can show; the service merges it
 * onto the stored run and checks the whole with {@link dynoRunIssues}.
 */
export const updateDynoRunInputSchema = dynoRunFieldsSchema
  .partial()
  .strict()
  .refine((v) => Object.keys(v).length > 0, { message: 'Nothing to change' })
  .superRefine((r, ctx) => {
    for (const issue of dynoRunIssues(r, { partial: true })) {
      ctx.addIssue({ code: 'custom', ...issue });
    }
  });
export type UpdateDynoRunInput = z.infer<typeof updateDynoRunInputSchema>;

// ---------------------------------------------------------------- the owner's choice

/** The correction the page shows runs in, and the engine factor the owner picked for R85. */
export const correctionChoiceSchema = z
  .object({
    standard: correctionStandardSchema,
    aspiration: z
      .enum(engineAspirations, { message: 'Choose turbocharged or naturally aspirated' })
      .optional(),
    engineFactor: numberField('Engine factor')
      .min(engineFactorLimits.min, {
        message: `Engine factor is at least ${engineFactorLimits.min}`,
      })
      .max(engineFactorLimits.max, {
        message: `Engine factor is at most ${engineFactorLimits.max}`,
      })
      .nullable()
      .optional(),
  })
  .strict();
export type CorrectionChoice = z.infer<typeof correctionChoiceSchema>;

// ---------------------------------------------------------------- results ("show the working")

/** A value that went into a figure, and where it came from. */
export const dynoWorkingInputSchema = z.object({
  name: z.string(),
  value: z.number(),
  /** Unit id (see dynoUnitLabels in shared/dyno). */
  unit: z.string(),
  from: z.enum(['weather', 'run', 'build', 'assumption', 'choice', 'figure']),
  /** The field it came from. */
  ref: z.string().optional(),
});
export type DynoWorkingInput = z.infer<typeof dynoWorkingInputSchema>;

export { workingConstantSchema };
export type { WorkingConstant } from './estimate';

/** One line of arithmetic, with the numbers filled in: "p_d = 97 − 1.061 = 95.94 kPa". */
export const dynoStepSchema = z.object({
  label: z.string(),
  expression: z.string(),
  value: z.number(),
  unit: z.string(),
});
export type DynoStep = z.infer<typeof dynoStepSchema>;

/** The working behind a figure: the formula, its inputs, constants with sources, and the steps. */
export const dynoWorkingSchema = z.object({
  formula: z.string(),
  inputs: z.array(dynoWorkingInputSchema),
  constants: z.array(workingConstantSchema),
  steps: z.array(dynoStepSchema),
});
export type DynoWorking = z.infer<typeof dynoWorkingSchema>;

/** A number the dyno pages show, with its unit id, label and working. */
export const dynoFigureSchema = z.object({
  label: z.string(),
  value: z.number(),
  unit: z.string(),
  working: dynoWorkingSchema,
});
export type DynoFigure = z.infer<typeof dynoFigureSchema>;

export const correctionWarningCodes = [
  'no-weather',
  'no-humidity',
  'outside-valid-range',
  'engine-factor-chosen',
  'engine-factor-default',
] as const;
export type CorrectionWarningCode = (typeof correctionWarningCodes)[number];
export const correctionWarningSchema = z.object({
  code: z.enum(correctionWarningCodes),
  message: z.string(),
});
export type CorrectionWarning = z.infer<typeof correctionWarningSchema>;

/** Where R85's engine factor f_m came from. */
export const engineFactorSources = ['computed', 'chosen', 'default'] as const;
export type EngineFactorSource = (typeof engineFactorSources)[number];

export const engineFactorResultSchema = z.object({
  value: z.number(),
  source: z.enum(engineFactorSources),
  /** Corrected fuel delivery parameter q_c = q / r in mg/(L·cycle), when computed. */
  qc: z.number().nullable(),
  /** Why it was not computed from the run, in plain words; null when computed. */
  reason: z.string().nullable(),
  working: dynoWorkingSchema,
});
export type EngineFactorResult = z.infer<typeof engineFactorResultSchema>;

/**
 * A correction factor and how it was reached. `applied` is false when the
 * standard could not be applied (no weather): the factor is then 1 and the
 * figures are as measured. `valid` is false when the factor lies outside the
 * standard's own range of validity (R85: 0.9…1.1): the factor is still
 * returned, unclipped, and `message` says so; the page shows it as outside
 * the standard's range.
 */
export const correctionResultSchema = z.object({
  standard: correctionStandardSchema,
  label: z.string(),
  factor: z.number(),
  applied: z.boolean(),
  valid: z.boolean(),
  message: z.string().nullable(),
  warnings: z.array(correctionWarningSchema),
  /** R85 only: the engine factor f_m. */
  engineFactor: engineFactorResultSchema.nullable(),
  working: dynoWorkingSchema,
});
export type CorrectionResult = z.infer<typeof correctionResultSchema>;

export const peakSources = ['entered', 'curve', 'none'] as const;
export type PeakSource = (typeof peakSources)[number];

/** Peaks of a run in its own units; null where not known. */
export const runPeaksSchema = z.object({
  power: z.number().nullable(),
  powerRpm: z.number().nullable(),
  torque: z.number().nullable(),
  torqueRpm: z.number().nullable(),
  /** Each peak typed in by the owner, or found in the curve, or not known. */
  powerSource: z.enum(peakSources),
  torqueSource: z.enum(peakSources),
});
export type RunPeaks = z.infer<typeof runPeaksSchema>;

/** A curve row with both power and torque filled in, saying which (if either) was computed. */
export const completedCurveRowSchema = z.object({
  rpm: z.number(),
  power: z.number(),
  torque: z.number(),
  boost: z.number().nullable(),
  egt: z.number().nullable(),
  mixture: z.number().nullable(),
  computed: z.enum(['power', 'torque']).nullable(),
});
export type CompletedCurveRow = z.infer<typeof completedCurveRowSchema>;

/** A run as shown under a correction: measured and corrected peaks, and the corrected curve. */
export const correctedRunSchema = z.object({
  correction: correctionResultSchema,
  basis: z.enum(powerBases),
  powerUnit: z.enum(dynoPowerUnits),
  torqueUnit: z.enum(dynoTorqueUnits),
  measured: runPeaksSchema,
  corrected: runPeaksSchema,
  /** Corrected peak power with its working (null when the run has none). */
  peakPower: dynoFigureSchema.nullable(),
  /** Corrected peak torque with its working (null when the run has none). */
  peakTorque: dynoFigureSchema.nullable(),
  /** The curve, sorted by rpm, completed and corrected. */
  curve: z.array(completedCurveRowSchema),
});
export type CorrectedRun = z.infer<typeof correctedRunSchema>;

// ---------------------------------------------------------------- what the API answers

/**
 * The correction choice as query parameters (`?standard=ece-r85&engineFactor=0.8`):
 * the standard defaults to {@link DEFAULT_CORRECTION_STANDARD}; numbers arrive as text.
 */
export const correctionQuerySchema = z.object({
  standard: correctionStandardSchema.default(DEFAULT_CORRECTION_STANDARD),
  aspiration: z
    .enum(engineAspirations, { message: 'Choose turbocharged or naturally aspirated' })
    .optional(),
  engineFactor: z.coerce
    .number<string>({ message: 'Engine factor must be a number' })
    .min(engineFactorLimits.min, { message: `Engine factor is at least ${engineFactorLimits.min}` })
    .max(engineFactorLimits.max, { message: `Engine factor is at most ${engineFactorLimits.max}` })
    .optional(),
});

/** Default units of a new run: hp and lbf·ft first, as the trade in the US reads them. */
export const defaultRunUnits: RunUnits = {
  powerUnit: 'hp',
  torqueUnit: 'lbf-ft',
  boostUnit: 'psi',
  egtUnit: 'f',
  mixtureKind: 'afr',
};

/**
 * The fields sent beside a curve CSV when a run is made from it (multipart
 * field `run`, JSON): everything but the curve, which comes from the file, and
 * the units, which the file's columns decide (a unit given here must agree).
 */
export const importDynoRunFieldsSchema = dynoRunFieldsSchema
  .omit({ curve: true })
  .partial({
    status: true,
    powerUnit: true,
    torqueUnit: true,
    boostUnit: true,
    egtUnit: true,
    mixtureKind: true,
  })
  .strict();
export type ImportDynoRunFields = z.infer<typeof importDynoRunFieldsSchema>;

/** Someone named on a record, or null when their account is gone. */
const personSchema = z.object({ id: z.string(), name: z.string() }).nullable();

/** What a run's attachment can be, judged by its content. */
export const dynoAttachmentKinds = ['pdf', 'image', 'text'] as const;
export type DynoAttachmentKind = (typeof dynoAttachmentKinds)[number];
export const dynoAttachmentKindLabels: Record<DynoAttachmentKind, string> = {
  pdf: 'PDF',
  image: 'Photo',
  text: 'Text or CSV file',
};
/** An attachment, bytes: the dyno's own file or a photo of its printout. */
export const MAX_DYNO_ATTACHMENT_BYTES = 15 * 1024 * 1024;
/** The multipart field an attachment or a curve CSV is sent in. */
export const dynoFileField = 'file';

export const dynoAttachmentSchema = z.object({
  name: z.string(),
  kind: z.enum(dynoAttachmentKinds),
  contentType: z.string(),
  bytes: z.number().int(),
  /** Members only: the bytes, as a download. */
  url: z.string(),
});
export type DynoAttachment = z.infer<typeof dynoAttachmentSchema>;

/** A run as stored: every figure as measured, in its own units. */
export const dynoRunSchema = z.object({
  id: z.string(),
  buildId: z.string(),
  sessionId: z.string(),
  /** Pull number within the session; kept when another run is deleted. */
  runNumber: z.number().int(),
  status: z.enum(runStatuses),
  abortReason: z.string().nullable(),
  gear: z.string(),
  tuneRevision: z.string(),
  notes: z.string(),
  ...runUnitsSchema.shape,
  peakPower: z.number().nullable(),
  peakPowerRpm: z.number().nullable(),
  peakTorque: z.number().nullable(),
  peakTorqueRpm: z.number().nullable(),
  boost: z.number().nullable(),
  egt: z.number().nullable(),
  mixture: z.number().nullable(),
  /** The run's own weather; null when the session's applies. */
  weather: weatherFields.nullable(),
  /** The curve as measured, sorted by rpm; empty when none was recorded. */
  curve: z.array(
    z.object({
      rpm: z.number(),
      power: z.number().nullable(),
      torque: z.number().nullable(),
      boost: z.number().nullable(),
      egt: z.number().nullable(),
      mixture: z.number().nullable(),
    }),
  ),
  attachment: dynoAttachmentSchema.nullable(),
  createdBy: personSchema,
  createdAt: z.string(),
  updatedAt: z.string(),
});
export type DynoRun = z.infer<typeof dynoRunSchema>;

export const dynoSessionSchema = z.object({
  id: z.string(),
  buildId: z.string(),
  date: z.string(),
  place: z.string(),
  dynoKind: z.enum(dynoKinds),
  /** Where this dyno measures: wheel for a chassis dyno, crank for an engine dyno. */
  basis: z.enum(powerBases),
  runBy: z.string(),
  notes: z.string(),
  weather: weatherFields.nullable(),
  /** The shop member whose dyno it is. */
  shop: personSchema,
  runCount: z.number().int(),
  createdBy: personSchema,
  createdAt: z.string(),
  updatedAt: z.string(),
});
export type DynoSession = z.infer<typeof dynoSessionSchema>;

/**
 * What the corrections and comparisons need from the build: its target, the
 * estimator's "most the build supports", the drivetrain loss assumption, and
 * the engine for R85's engine factor (aspiration, displacement, BSFC).
 */
export const dynoPlanSchema = z.object({
  target: z.object({
    powerHp: z.number(),
    basis: z.enum(powerBases),
    torqueLbft: z.number().nullable(),
  }),
  /** Null when no part carries a rating. `limitedBy` names the weakest link. */
  supported: z
    .object({ crankPowerHp: z.number(), wheelPowerHp: z.number(), limitedBy: z.string() })
    .nullable(),
  drivetrainLossPct: z.number(),
  engine: z.object({
    aspiration: z.enum(engineAspirations),
    displacementL: z.number().nullable(),
    bsfc: z.number().nullable(),
    bsfcUnit: z.enum(['lb-per-hp-h', 'g-per-kwh']),
    drivetrainLossPct: z.number().nullable(),
  }),
});
export type DynoPlan = z.infer<typeof dynoPlanSchema>;

/** A session in the list, with its best run under the chosen correction (null before a complete run). */
export const dynoSessionSummarySchema = dynoSessionSchema.extend({
  best: z
    .object({
      runId: z.string(),
      runNumber: z.number().int().nullable(),
      basis: z.enum(powerBases),
      powerUnit: z.enum(dynoPowerUnits),
      torqueUnit: z.enum(dynoTorqueUnits),
      /** Corrected, in the run's units. */
      peakPower: z.number().nullable(),
      peakPowerRpm: z.number().nullable(),
      peakPowerHp: z.number(),
      peakTorque: z.number().nullable(),
      peakTorqueRpm: z.number().nullable(),
      factor: z.number(),
      applied: z.boolean(),
      valid: z.boolean(),
    })
    .nullable(),
});
export type DynoSessionSummary = z.infer<typeof dynoSessionSummarySchema>;
