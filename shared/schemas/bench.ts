/**
 * Bench results: injector flow-bench sheets of one part (an injector set),
 * their test points and the value each injector position gave at each point.
 * Input schemas are shared by the client forms and the server; the result
 * schemas describe what shared/bench computes. Types are z.infer of these.
 *
 * Values live with their point: `points[i].values[p − 1]` is injector position
 * p's value at point i, null where none was recorded (a missing value is never
 * a zero). Positions are therefore unique by construction and run from 1; how
 * far they may run depends on the build, so check a sheet against the build's
 * cylinder count with {@link benchSheetInputSchemaFor} (or
 * {@link benchCylinderIssues} after merging an edit). Error paths name the
 * cell: `points.2.values.4` is the third point, injector 5.
 */
import { z } from 'zod';
import {
  BENCH_MAX_CYLINDERS,
  BENCH_MAX_POINTS,
  BENCH_MAX_VALUE,
  benchFluidTemperatureRangeC,
} from '@shared/bench/limits';
import { testPointKinds, toleranceTypes, unitFamilyOfKind } from '@shared/bench/points';
import { benchUnits, isFlowUnit, isPressureUnit } from '@shared/bench/units';
import { convertTemperature } from '@shared/units/convert';
import { labelsOf } from '@shared/units/labels';
import { powerBases } from './builds';
import { idSchema, isoDateSchema, trimmed } from './common';
import { workingConstantSchema } from './estimate';

// ---------------------------------------------------------------- text and numbers

/** One injector's value at a point: a number of zero or more in the point's unit, or null when not measured. */
export const benchValueSchema = z
  .number({ message: 'Enter a number, or leave the cell empty' })
  .min(0, { message: 'A bench value cannot be negative' })
  .max(BENCH_MAX_VALUE, { message: 'That value is too large' })
  .nullable();

const optionalNonNegative = (what: string) =>
  z
    .number({ message: `Enter the ${what}` })
    .min(0, { message: `The ${what} cannot be negative` })
    .max(BENCH_MAX_VALUE, { message: `That ${what} is too large` })
    .nullable()
    .optional();

// ---------------------------------------------------------------- test points

export const benchToleranceSchema = z
  .object({
    type: z.enum(toleranceTypes, { message: 'Choose ± % or ± amount' }),
    /** Percent of the set mean (or nominal), or an amount in the point's unit. */
    value: z
      .number({ message: 'Enter the tolerance' })
      .positive({ message: 'A tolerance is above zero' })
      .max(BENCH_MAX_VALUE, { message: 'That tolerance is too large' }),
  })
  .strict();
export type BenchTolerance = z.infer<typeof benchToleranceSchema>;

export const testPointFieldsSchema = z.object({
  kind: z.enum(testPointKinds, { message: 'Choose a kind of test point from the list' }),
  /** The point's name on the sheet and its column in a CSV; unique in a sheet. */
  label: trimmed(80, 'Label').min(1, { message: 'Name the test point' }),
  unit: z.enum(benchUnits, { message: 'Choose a unit from the list' }),
  /** Stroke rate the point was run at; needed to turn ml/min into mm³/stroke. */
  strokesPerMin: z
    .number({ message: 'Enter strokes per minute' })
    .positive({ message: 'A stroke rate is above zero' })
    .max(10_000, { message: 'At most 10000 strokes/min' })
    .nullable()
    .optional(),
  /** Free text, e.g. "at 1,600 bar, 1,000 strokes/min". */
  condition: trimmed(200, 'Condition').optional(),
  /** The maker's figure for the point, in the point's unit. */
  nominal: optionalNonNegative('nominal value'),
  tolerance: benchToleranceSchema,
  /** Return flow only: the maker's upper limit, in the point's unit. */
  returnLimit: optionalNonNegative("maker's return-flow limit"),
  /** values[p − 1] is injector position p's value; null where not measured. */
  values: z
    .array(benchValueSchema, { message: 'A list of values, one per injector position' })
    .max(BENCH_MAX_CYLINDERS, { message: `At most ${BENCH_MAX_CYLINDERS} injector positions` }),
});

type TestPointFields = z.infer<typeof testPointFieldsSchema>;

/** Rules between a point's fields; issues carry paths relative to the point. */
function checkTestPoint(p: TestPointFields, ctx: z.RefinementCtx) {
  const family = unitFamilyOfKind[p.kind];
  if (family === 'flow' && !isFlowUnit(p.unit)) {
    ctx.addIssue({
      code: 'custom',
      path: ['unit'],
      message: 'Use a flow unit (mm³/stroke, ml/1000 strokes or ml/min) for this point',
    });
  }
  if (family === 'pressure' && !isPressureUnit(p.unit)) {
    ctx.addIssue({
      code: 'custom',
      path: ['unit'],
      message: 'Use a pressure unit (bar, MPa or psi) for an opening pressure',
    });
  }
  const isDelivery = ['full-load', 'part-load', 'idle', 'pilot'].includes(p.kind);
  if (isDelivery && p.unit === 'ml-per-min' && p.strokesPerMin == null) {
    ctx.addIssue({
      code: 'custom',
      path: ['strokesPerMin'],
      message: 'Enter the stroke rate the ml/min were measured at',
    });
  }
  if (p.kind === 'return-flow') {
    if (p.tolerance.type !== 'absolute') {
      ctx.addIssue({
        code: 'custom',
        path: ['tolerance', 'type'],
        message: "Return flow takes a tolerance in the point's own unit (± amount)",
      });
    }
    if (p.nominal != null) {
      ctx.addIssue({
        code: 'custom',
        path: ['nominal'],
        message: "For return flow, enter the maker's limit instead of a nominal value",
      });
    }
  } else if (p.returnLimit != null) {
    ctx.addIssue({
      code: 'custom',
      path: ['returnLimit'],
      message: "Only a return-flow point has a maker's limit",
    });
  }
  if (p.tolerance.type === 'percent' && p.tolerance.value > 100) {
    ctx.addIssue({
      code: 'custom',
      path: ['tolerance', 'value'],
      message: 'A percentage tolerance is at most 100 %',
    });
  }
}

/** One test point with its values. */
export const testPointSchema = testPointFieldsSchema.strict().superRefine(checkTestPoint);
export type TestPointInput = z.input<typeof testPointSchema>;
export type TestPoint = z.output<typeof testPointSchema>;

/** Labels compared as the CSV header and the before/after match read them. */
export function normalizeLabel(label: string): string {
  return label.trim().replace(/\s+/g, ' ').toLowerCase();
}

const pointsSchema = z
  .array(testPointSchema, { message: 'A list of test points' })
  .min(1, { message: 'Add at least one test point' })
  .max(BENCH_MAX_POINTS, { message: `At most ${BENCH_MAX_POINTS} test points` })
  .superRefine((points, ctx) => {
    const seen = new Map<string, number>();
    points.forEach((p, i) => {
      const key = normalizeLabel(p.label);
      const first = seen.get(key);
      if (first !== undefined) {
        ctx.addIssue({
          code: 'custom',
          path: [i, 'label'],
          message: `Point ${first + 1} already has this label; give each point its own`,
        });
      } else seen.set(key, i);
    });
  });

// ---------------------------------------------------------------- sheets

export const fluidTemperatureUnits = ['c', 'f'] as const;
export type FluidTemperatureUnit = (typeof fluidTemperatureUnits)[number];
export const fluidTemperatureUnitLabels = labelsOf(fluidTemperatureUnits);

export const fluidTemperatureSchema = z
  .object({
    value: z.number({ message: 'Enter the fluid temperature' }),
    unit: z.enum(fluidTemperatureUnits, { message: 'Choose °C or °F' }),
  })
  .strict()
  .superRefine((t, ctx) => {
    const c = convertTemperature(t.value, t.unit, 'c');
    const { min, max } = benchFluidTemperatureRangeC;
    if (c < min || c > max) {
      const lo = Math.round(convertTemperature(min, 'c', t.unit));
      const hi = Math.round(convertTemperature(max, 'c', t.unit));
      ctx.addIssue({
        code: 'custom',
        path: ['value'],
        message: `Between ${lo} and ${hi} ${fluidTemperatureUnitLabels[t.unit]}`,
      });
    }
  });
export type FluidTemperature = z.infer<typeof fluidTemperatureSchema>;

export const benchSheetFieldsSchema = z.object({
  /** The injector set (a part of the build) the sheet tests. */
  partId: idSchema,
  /** When in the part's life the test was run, e.g. "as received", "after rebuild". */
  occasion: trimmed(120, 'Occasion').min(1, {
    message: 'Say when the test was run, e.g. "as received"',
  }),
  testedOn: isoDateSchema,
  /** Who ran the test: a person or a shop, as free text. */
  testedBy: trimmed(120, 'Tested by').optional(),
  /** Test fluid, e.g. "calibration fluid to ISO 4113". */
  fluid: trimmed(200, 'Test fluid').optional(),
  fluidTemperature: fluidTemperatureSchema.nullable().optional(),
  notes: trimmed(4000, 'Notes').optional(),
  points: pointsSchema,
});

/** POST body of a new sheet. Check it against the build too: {@link benchSheetInputSchemaFor}. */
export const createBenchSheetInputSchema = benchSheetFieldsSchema.strict();
export type CreateBenchSheetInput = z.infer<typeof createBenchSheetInputSchema>;

/** PATCH body: any of the fields; `points`, when sent, replaces every point and value. */
export const updateBenchSheetInputSchema = benchSheetFieldsSchema
  .partial()
  .strict()
  .refine((v) => Object.keys(v).length > 0, { message: 'Nothing to change' });
export type UpdateBenchSheetInput = z.infer<typeof updateBenchSheetInputSchema>;

export type BenchIssue = { path: (string | number)[]; message: string };

/**
 * Values at positions beyond the build's cylinders, one issue per cell with
 * the path `points.i.values.j`. For the service to run on a sheet after an
 * edit is merged onto it (or when the build's cylinder count changes).
 */
export function benchCylinderIssues(
  points: readonly { values: readonly (number | null)[] }[],
  cylinders: number,
): BenchIssue[] {
  const issues: BenchIssue[] = [];
  points.forEach((p, i) => {
    for (let j = cylinders; j < p.values.length; j++) {
      issues.push({
        path: ['points', i, 'values', j],
        message: `Injector ${j + 1} is beyond the build's ${cylinders} cylinder${cylinders === 1 ? '' : 's'}`,
      });
    }
  });
  return issues;
}

function assertCylinders(cylinders: number) {
  if (!Number.isInteger(cylinders) || cylinders < 1 || cylinders > BENCH_MAX_CYLINDERS) {
    throw new RangeError(
      `cylinders must be a whole number from 1 to ${BENCH_MAX_CYLINDERS} (got ${cylinders})`,
    );
  }
}

/** The create schema for a build with `cylinders` cylinders: no value beyond the last position. */
export function benchSheetInputSchemaFor(cylinders: number) {
  assertCylinders(cylinders);
  return createBenchSheetInputSchema.superRefine((sheet, ctx) => {
    for (const issue of benchCylinderIssues(sheet.points, cylinders))
      ctx.addIssue({ code: 'custom', ...issue });
  });
}

/** The update schema for a build with `cylinders` cylinders. */
export function updateBenchSheetInputSchemaFor(cylinders: number) {
  assertCylinders(cylinders);
  return updateBenchSheetInputSchema.superRefine((edit, ctx) => {
    if (!edit.points) return;
    for (const issue of benchCylinderIssues(edit.points, cylinders))
      ctx.addIssue({ code: 'custom', ...issue });
  });
}

// ---------------------------------------------------------------- results

/** Statistics of one point over the values present (see shared/bench/statistics). */
export const benchStatisticsSchema = z.object({
  /** Values present. */
  n: z.number(),
  /** Positions with no value. */
  missing: z.number(),
  mean: z.number().nullable(),
  /** n − 1 form; null below two values. */
  sampleSd: z.number().nullable(),
  /** n form. */
  populationSd: z.number().nullable(),
  /** 100 · sample SD / mean. */
  cvPct: z.number().nullable(),
  min: z.number().nullable(),
  max: z.number().nullable(),
  /** 100 · max |x − mean| / mean. */
  maxDeviationPct: z.number().nullable(),
  /** 100 · (max − min) / mean. */
  spreadPct: z.number().nullable(),
});
export type BenchStatistics = z.infer<typeof benchStatisticsSchema>;

/** How a value sits against a band: inside (edges included), under, over, or no band to judge by. */
export const bandVerdicts = ['in', 'low', 'high', 'not-judged'] as const;
export type BandVerdict = (typeof bandVerdicts)[number];

/** What can be wrong with one injector at one point. */
export const injectorFlags = [
  'low',
  'high',
  'below-nominal',
  'above-nominal',
  'worn',
  'over-limit',
] as const;
export type InjectorFlag = (typeof injectorFlags)[number];
export const injectorFlagLabels: Record<InjectorFlag, string> = {
  low: 'Low against the set',
  high: 'High against the set',
  'below-nominal': "Below the maker's figure",
  'above-nominal': "Above the maker's figure",
  worn: 'Worn',
  'over-limit': "Over the maker's limit",
};

export const injectorStatuses = [
  'in-tolerance',
  'out-of-tolerance',
  'not-judged',
  'missing',
] as const;
export type InjectorStatus = (typeof injectorStatuses)[number];
export const injectorStatusLabels: Record<InjectorStatus, string> = {
  'in-tolerance': 'In tolerance',
  'out-of-tolerance': 'Out of tolerance',
  'not-judged': 'Not judged',
  missing: 'Not measured',
};

const bandSchema = z.object({ low: z.number(), high: z.number() });

/** A return-flow injector against the worn rule and the maker's limit. */
export const returnFlowCheckSchema = z.object({
  /** Median of the other injectors' return flow; null with fewer than two others. */
  othersMedian: z.number().nullable(),
  /** value ÷ othersMedian; null when the median is null or zero. */
  ratio: z.number().nullable(),
  /** value − othersMedian, in the point's unit. */
  excess: z.number().nullable(),
  worn: z.boolean(),
  overLimit: z.boolean(),
});
export type ReturnFlowCheck = z.infer<typeof returnFlowCheckSchema>;

export const injectorResultSchema = z.object({
  position: z.number(),
  value: z.number().nullable(),
  /** value − set mean, in the point's unit. */
  deviation: z.number().nullable(),
  /** 100 · (value − mean) / mean. */
  deviationPct: z.number().nullable(),
  vsMean: z.enum(bandVerdicts),
  vsNominal: z.enum(bandVerdicts),
  /** value − nominal, in the point's unit. */
  nominalDeviation: z.number().nullable(),
  nominalDeviationPct: z.number().nullable(),
  /** Return-flow points only. */
  returnFlow: returnFlowCheckSchema.nullable(),
  flags: z.array(z.enum(injectorFlags)),
  status: z.enum(injectorStatuses),
});
export type InjectorResult = z.infer<typeof injectorResultSchema>;

export const pointStatuses = [
  'in-tolerance',
  'out-of-tolerance',
  'not-judged',
  'no-values',
] as const;
export type PointStatus = (typeof pointStatuses)[number];

export const pointResultSchema = z.object({
  /** Index of the point in the sheet. */
  index: z.number(),
  kind: z.enum(testPointKinds),
  label: z.string(),
  unit: z.enum(benchUnits),
  strokesPerMin: z.number().nullable(),
  condition: z.string(),
  nominal: z.number().nullable(),
  tolerance: benchToleranceSchema,
  returnLimit: z.number().nullable(),
  statistics: benchStatisticsSchema,
  /** The band around the set mean, in the point's unit; null below two values and for return flow. */
  meanBand: bandSchema.nullable(),
  /** The band around the nominal; null without a nominal. */
  nominalBand: bandSchema.nullable(),
  injectors: z.array(injectorResultSchema),
  /** Positions with at least one flag, ascending. */
  flaggedPositions: z.array(z.number()),
  status: z.enum(pointStatuses),
  /** The point in words, numbers rounded for reading. */
  summary: z.string(),
});
export type PointResult = z.infer<typeof pointResultSchema>;

export const findingKinds = [
  'worn',
  'over-limit',
  'set-over-limit',
  'set-below-nominal',
  'set-above-nominal',
  'low',
  'high',
  'below-nominal',
  'above-nominal',
  'not-measured',
] as const;
export type FindingKind = (typeof findingKinds)[number];

/** One thing the set verdict says, with the cells it is about. */
export const benchFindingSchema = z.object({
  kind: z.enum(findingKinds),
  pointIndex: z.number(),
  positions: z.array(z.number()),
  text: z.string(),
});
export type BenchFinding = z.infer<typeof benchFindingSchema>;

export const sheetStatuses = [
  'in-tolerance',
  'out-of-tolerance',
  'not-judged',
  'no-values',
] as const;
export type SheetStatus = (typeof sheetStatuses)[number];

export const benchSheetResultSchema = z.object({
  cylinders: z.number(),
  points: z.array(pointResultSchema),
  /** Worst first: worn, over the limit, against the maker's figure, against the set, not measured. */
  findings: z.array(benchFindingSchema),
  status: z.enum(sheetStatuses),
  /** The set verdict in plain words, e.g. "Matched within ±0.6 % at full load". */
  verdict: z.string(),
});
export type BenchSheetResult = z.infer<typeof benchSheetResultSchema>;

// ---------------------------------------------------------------- comparison

const comparedStatisticsSchema = benchStatisticsSchema.pick({
  n: true,
  mean: true,
  cvPct: true,
  spreadPct: true,
  maxDeviationPct: true,
});

export const pointComparisonSchema = z.object({
  kind: z.enum(testPointKinds),
  label: z.string(),
  /** The before sheet's unit; after values are restated in it when the sheets differ. */
  unit: z.enum(benchUnits),
  strokesPerMin: z.number().nullable(),
  /** True when the after sheet recorded the point in another unit. */
  converted: z.boolean(),
  injectors: z.array(
    z.object({
      position: z.number(),
      before: z.number().nullable(),
      after: z.number().nullable(),
      /** after − before in the point's unit; null when either is missing. */
      change: z.number().nullable(),
      /** 100 · (after − before) / before. */
      changePct: z.number().nullable(),
    }),
  ),
  before: comparedStatisticsSchema,
  after: comparedStatisticsSchema,
  /** after − before, in percentage points. */
  cvChange: z.number().nullable(),
  spreadChange: z.number().nullable(),
  maxDeviationChange: z.number().nullable(),
  meanChange: z.number().nullable(),
  meanChangePct: z.number().nullable(),
});
export type PointComparison = z.infer<typeof pointComparisonSchema>;

const pointRefSchema = z.object({ kind: z.enum(testPointKinds), label: z.string() });

export const benchComparisonSchema = z.object({
  points: z.array(pointComparisonSchema),
  onlyBefore: z.array(pointRefSchema),
  onlyAfter: z.array(pointRefSchema),
  /** Points in both sheets whose units cannot be restated in each other. */
  notComparable: z.array(pointRefSchema.extend({ reason: z.string() })),
});
export type BenchComparison = z.infer<typeof benchComparisonSchema>;

// ---------------------------------------------------------------- imbalance cost

/** A value that went into a bench figure. */
export const benchWorkingInputSchema = z.object({
  name: z.string(),
  value: z.number(),
  unit: z.string(),
  from: z.enum(['sheet', 'build', 'figure']),
  ref: z.string().optional(),
});
export type BenchWorkingInput = z.infer<typeof benchWorkingInputSchema>;

/** One line of the arithmetic, with its result. */
export const benchWorkingStepSchema = z.object({
  text: z.string(),
  value: z.number(),
  unit: z.string(),
});
export type BenchWorkingStep = z.infer<typeof benchWorkingStepSchema>;

/** The rule a figure rests on, and how firm it is. */
export const benchRuleSchema = z.object({
  wording: z.string(),
  status: z.enum(['rule of thumb', 'common practice', 'definition']),
  source: z.string(),
});

/** "Show the working" of a bench figure: formula, inputs, constants, steps and the rule. */
export const benchWorkingSchema = z.object({
  formula: z.string(),
  inputs: z.array(benchWorkingInputSchema),
  constants: z.array(workingConstantSchema),
  steps: z.array(benchWorkingStepSchema),
  rule: benchRuleSchema,
});
export type BenchWorking = z.infer<typeof benchWorkingSchema>;

export const benchFigureSchema = z.object({
  label: z.string(),
  value: z.number(),
  /** Unit id, as the estimator's figures: '%', 'hp-crank', 'hp-wheel'. */
  unit: z.string(),
  working: benchWorkingSchema,
});
export type BenchFigure = z.infer<typeof benchFigureSchema>;

/** The power a build's target is asked to carry, as the estimator takes it. */
export const benchPowerTargetSchema = z.object({
  powerHp: z
    .number({ message: 'Enter the target horsepower' })
    .positive({ message: 'Power must be above zero' })
    .max(5000, { message: 'At most 5000 hp' }),
  basis: z.enum(powerBases, { message: 'Choose crank or wheel' }),
});
export type BenchPowerTarget = z.infer<typeof benchPowerTargetSchema>;

export const imbalanceCostSchema = z.discriminatedUnion('available', [
  z.object({
    available: z.literal(true),
    pointIndex: z.number(),
    pointLabel: z.string(),
    /** The richest injector's position (the lowest position when several tie). */
    richestPosition: z.number(),
    /** Share of peak power given up, %. */
    sharePct: benchFigureSchema,
    /** Power given up at the target, in the target's basis. */
    power: benchFigureSchema,
    /** In words, rounded: "Imbalance at full load costs about 14 hp of the 700 hp target (2 %, rule of thumb)". */
    summary: z.string(),
  }),
  z.object({ available: z.literal(false), reason: z.string() }),
]);
export type ImbalanceCost = z.infer<typeof imbalanceCostSchema>;

export const imbalanceRecoverySchema = z.object({
  before: imbalanceCostSchema,
  after: imbalanceCostSchema,
  /** before − after power given up: what the rebuild won back (negative when it lost). */
  recovered: benchFigureSchema.nullable(),
  /** Why `recovered` is null. */
  reason: z.string().nullable(),
  /** In words, rounded; the reason when nothing can be said. */
  summary: z.string(),
});
export type ImbalanceRecovery = z.infer<typeof imbalanceRecoverySchema>;

// ---------------------------------------------------------------- imports from files

/** One refused cell of a CSV or pasted block; row and column count from 1 (null for the whole file). */
export const benchCellErrorSchema = z.object({
  row: z.number().nullable(),
  column: z.number().nullable(),
  /** The column's heading in a CSV; null for a pasted block or the whole file. */
  columnName: z.string().nullable(),
  message: z.string(),
});
export type BenchCellError = z.infer<typeof benchCellErrorSchema>;

// ---------------------------------------------------------------- the shop's original sheet

/** Largest original sheet accepted: 20 MiB (a phone photo or a scanned PDF of a page or two). */
export const BENCH_ORIGINAL_MAX_BYTES = 20 * 1024 * 1024;
/** The multipart field an original sheet (and a CSV of values) travels in. */
export const benchUploadField = 'file';
/** For the file picker's accept attribute. */
export const benchOriginalAccept =
  'application/pdf,.pdf,image/jpeg,image/png,image/webp,image/heic,image/heif,.heic,.heif';

/** What an original sheet is, by its content: a PDF, or a photo in one of these formats. */
export const benchOriginalFormats = ['pdf', 'jpeg', 'png', 'webp', 'heif'] as const;
export type BenchOriginalFormat = (typeof benchOriginalFormats)[number];

/** The shop's original sheet as the API describes it. Every file is served as a download. */
export type BenchOriginal = {
  id: string;
  /** The name it was uploaded under (its extension follows the content). */
  fileName: string;
  format: BenchOriginalFormat;
  /** The stored original's type: application/pdf, image/jpeg, image/png or image/webp. */
  contentType: string;
  /** Bytes of the stored original. */
  bytes: number;
  /** Upright size in pixels; null for a PDF. */
  width: number | null;
  height: number | null;
  /** The original as uploaded (a photo re-encoded without its metadata, at full size). */
  url: string;
  /** A JPEG copy for the page and a thumbnail; null for a PDF. */
  webUrl: string | null;
  thumbUrl: string | null;
  uploadedBy: { id: string; name: string } | null;
  createdAt: string;
};

// ---------------------------------------------------------------- API answers

/** A stored sheet as the API returns it; `points[i].values` run from position 1 to the build's cylinders. */
export type BenchSheet = {
  id: string;
  buildId: string;
  partId: string;
  partName: string;
  occasion: string;
  testedOn: string;
  testedBy: string;
  fluid: string;
  fluidTemperature: FluidTemperature | null;
  notes: string;
  points: TestPoint[];
  /** The shop member who entered it; null when the owner or crew typed it in. */
  shopUserId: string | null;
  enteredBy: { id: string; name: string } | null;
  updatedBy: { id: string; name: string } | null;
  original: BenchOriginal | null;
  createdAt: string;
  updatedAt: string;
};

/** A sheet in a list: what it is and how it came out, without its values. */
export type BenchSheetSummary = Omit<BenchSheet, 'points' | 'notes'> & {
  pointCount: number;
  status: SheetStatus;
  verdict: string;
};

/** GET, POST and PATCH of one sheet: the sheet, its judgement and what its imbalance costs. */
export type BenchSheetAnswer = {
  sheet: BenchSheet;
  /** Positions judged: the build's cylinders (or more, if a value sits beyond them). */
  cylinders: number;
  result: BenchSheetResult;
  imbalance: ImbalanceCost;
  /** The build's target the imbalance is costed at. */
  target: BenchPowerTarget;
};

/** GET …/bench-sheets/compare?before=&after=: two sheets of one part side by side. */
export type BenchComparisonAnswer = {
  before: BenchSheetSummary;
  after: BenchSheetSummary;
  cylinders: number;
  comparison: BenchComparison;
  recovery: ImbalanceRecovery;
  target: BenchPowerTarget;
};

/** The query of the comparison route. */
export const benchCompareQuerySchema = z
  .object({
    before: idSchema.optional(),
    after: idSchema.optional(),
  })
  .strict()
  .superRefine((q, ctx) => {
    if (!q.before)
      ctx.addIssue({
        code: 'custom',
        path: ['before'],
        message: 'Choose the sheet to compare from',
      });
    if (!q.after)
      ctx.addIssue({
        code: 'custom',
        path: ['after'],
        message: 'Choose the sheet to compare with',
      });
    if (q.before && q.before === q.after)
      ctx.addIssue({ code: 'custom', path: ['after'], message: 'Choose two different sheets' });
  });

/** The query of the list route. */
export const benchListQuerySchema = z.object({ partId: idSchema.optional() }).strict();

/** One CSV row that failed, as the import answers it: its row in the file and why, per column. */
export type BenchImportRowError = { row: number; fields: Record<string, string> };
