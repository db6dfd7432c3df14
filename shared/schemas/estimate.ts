/**
 * Request and response schemas of the power estimator (POST /api/estimate,
 * GET /api/builds/:buildId/estimate, GET/PUT /api/builds/:buildId/assumptions).
 * Types are z.infer of these, never written twice.
 */
import { z } from 'zod';
import {
  assumptionSpecs,
  bsfcInRange,
  bsfcRangeMessage,
  defaultBsfc,
  type AssumptionSpec,
} from '@shared/estimate/assumptions';
import { labelsOf } from '@shared/units/labels';
import { bsfcUnits, type BsfcUnit } from '@shared/units/convert';
import { powerBases } from './builds';
import { trimmed } from './common';
import { partCategories, ratingUnits } from './parts';

export { bsfcUnits, type BsfcUnit };

export const bsfcUnitLabels = labelsOf(bsfcUnits);

/** A number within an assumption's range, with field messages; defaults when omitted. */
function assumptionNumber(spec: AssumptionSpec, what: string) {
  let schema = z
    .number({ message: `Enter the ${what}` })
    .min(spec.min, { message: `At least ${spec.min}` })
    .max(spec.max, { message: `At most ${spec.max}` });
  if (spec.integer) schema = schema.int({ message: 'Use a whole number' });
  return schema.default(spec.default);
}

const assumptionFields = {
  /** In the unit of bsfcUnit; the default (0.40 lb/(hp·h)) is filled in that unit when omitted. */
  bsfc: z
    .number({ message: 'Enter the brake specific fuel consumption' })
    .positive({ message: 'Brake specific fuel consumption is above zero' })
    .max(1000, { message: 'That is far too large for a brake specific fuel consumption' })
    .optional(),
  bsfcUnit: z.enum(bsfcUnits, { message: 'Choose lb/(hp·h) or g/kWh' }).default('lb-per-hp-h'),
  afr: assumptionNumber(assumptionSpecs.afr, 'air–fuel ratio'),
  fuelDensityKgPerL: assumptionNumber(assumptionSpecs.fuelDensityKgPerL, 'fuel density in kg/L'),
  drivetrainLossPct: assumptionNumber(assumptionSpecs.drivetrainLossPct, 'drivetrain loss in %'),
  peakRpm: assumptionNumber(assumptionSpecs.peakRpm, 'rpm at peak power'),
  tightMarginPct: assumptionNumber(assumptionSpecs.tightMarginPct, '"tight" margin in %'),
};

type BsfcFields = { bsfc?: number; bsfcUnit: BsfcUnit };

function checkBsfc(value: BsfcFields, ctx: z.RefinementCtx) {
  if (value.bsfc !== undefined && !bsfcInRange(value.bsfc, value.bsfcUnit)) {
    ctx.addIssue({ code: 'custom', path: ['bsfc'], message: bsfcRangeMessage(value.bsfcUnit) });
  }
}

function fillBsfc<T extends BsfcFields>(value: T): T & { bsfc: number } {
  return { ...value, bsfc: value.bsfc ?? defaultBsfc(value.bsfcUnit) };
}

/**
 * A build's saved assumptions, as the owner edits them (PUT body). Every field
 * may be left out and takes its default; PUT replaces the whole set.
 */
export const assumptionsInputSchema = z
  .object(assumptionFields)
  .strict()
  .superRefine(checkBsfc)
  .transform(fillBsfc);
export type AssumptionsInput = z.input<typeof assumptionsInputSchema>;
export type Assumptions = z.output<typeof assumptionsInputSchema>;

/** The assumptions of a stateless estimate: the saved set plus the cylinder count. */
export const estimateAssumptionsInputSchema = z
  .object({
    ...assumptionFields,
    cylinders: assumptionNumber(assumptionSpecs.cylinders, 'number of cylinders'),
  })
  .strict()
  .superRefine(checkBsfc)
  .transform(fillBsfc);
export type EstimateAssumptions = z.output<typeof estimateAssumptionsInputSchema>;

/** GET/PUT /api/builds/:buildId/assumptions answer. `isDefault` until the owner saves a set. */
export type AssumptionsResponse = { assumptions: Assumptions; isDefault: boolean };

export const estimateTargetSchema = z
  .object({
    // At least 0.1 hp, the least a build can store: far smaller targets make every
    // rating look millions of times too large and, near zero, infinitely so.
    powerHp: z
      .number({ message: 'Enter the target horsepower' })
      .min(0.1, { message: 'Power must be above zero: at least 0.1 hp' })
      .max(5000, { message: 'At most 5000 hp' }),
    basis: z.enum(powerBases, { message: 'Choose crank or wheel' }),
    /**
     * A crank torque target in lbf·ft. Torque-rated parts are compared with the larger of
     * it and the torque at peak power.
     */
    torqueLbft: z
      .number({ message: 'Enter torque in lbf·ft' })
      .positive({ message: 'Torque must be above zero' })
      .max(10_000, { message: 'At most 10000 lbf·ft' })
      .nullable()
      .optional(),
  })
  .strict();
export type EstimateTarget = z.output<typeof estimateTargetSchema>;

/** A rated component: a part's rating as the estimator needs it. */
export const estimateComponentSchema = z
  .object({
    id: z
      .string({ message: 'Give the component an id' })
      .trim()
      .min(1, { message: 'Give the component an id' })
      .max(100, { message: 'Ids are at most 100 characters' }),
    name: trimmed(160, 'Name').min(1, { message: 'Name the part' }),
    category: z.enum(partCategories, { message: 'Choose a category from the list' }),
    ratingValue: z
      .number({ message: 'Enter the rated value' })
      .positive({ message: 'A rating is above zero' })
      .max(100_000, { message: 'That rating is too large' }),
    ratingUnit: z.enum(ratingUnits, { message: 'Choose a rating unit from the list' }),
    quantity: z
      .number({ message: 'Enter a quantity' })
      .int({ message: 'Quantity is a whole number' })
      .min(1, { message: 'Quantity is at least 1' })
      .max(10_000, { message: 'Quantity is at most 10000' })
      .default(1),
    ratingFor: trimmed(200, 'Rated for').optional(),
    /**
     * Set by the server for a part a shop may not see: named by its category only, and
     * not a link to the ledger (the shop's ledger does not hold it).
     */
    anonymised: z.boolean({ message: 'Anonymised is true or false' }).optional(),
  })
  .strict();
export type EstimateComponentInput = z.input<typeof estimateComponentSchema>;
export type EstimateComponent = z.output<typeof estimateComponentSchema>;

export const MAX_ESTIMATE_COMPONENTS = 500;

/** POST /api/estimate body. */
export const estimateRequestSchema = z
  .object({
    target: estimateTargetSchema,
    assumptions: estimateAssumptionsInputSchema.prefault({}),
    components: z
      .array(estimateComponentSchema)
      .max(MAX_ESTIMATE_COMPONENTS, { message: `At most ${MAX_ESTIMATE_COMPONENTS} components` })
      .superRefine((components, ctx) => {
        const seen = new Set<string>();
        components.forEach((c, i) => {
          if (seen.has(c.id))
            ctx.addIssue({ code: 'custom', path: [i, 'id'], message: 'Ids must be unique' });
          seen.add(c.id);
        });
      })
      .default([]),
  })
  .strict();
export type EstimateRequestInput = z.input<typeof estimateRequestSchema>;
/** What the estimator computes from: every default filled in. */
export type EstimateInput = z.output<typeof estimateRequestSchema>;

// ---------------------------------------------------------------- response

/**
 * A value that went into a figure, by where it comes from: the build's target, the build
 * itself (its cylinder count), an assumption, a part's rating or another figure.
 */
export const workingInputSources = ['target', 'build', 'assumption', 'part', 'figure'] as const;
export const workingInputSchema = z.object({
  name: z.string(),
  value: z.number(),
  unit: z.string(),
  from: z.enum(workingInputSources),
  /** The assumption key, the component id or the requirement key it came from. */
  ref: z.string().optional(),
});
export type WorkingInput = z.infer<typeof workingInputSchema>;

/** A constant used by a figure, with where it comes from. */
export const workingConstantSchema = z.object({
  name: z.string(),
  value: z.number(),
  unit: z.string(),
  source: z.string(),
});
export type WorkingConstant = z.infer<typeof workingConstantSchema>;

/** The arithmetic behind a figure, for "show the working". */
export const workingSchema = z.object({
  formula: z.string(),
  inputs: z.array(workingInputSchema),
  constants: z.array(workingConstantSchema),
});
export type Working = z.infer<typeof workingSchema>;

/** Every number the estimator shows: value, unit id (see figureUnitLabels), label and working. */
export const figureSchema = z.object({
  label: z.string(),
  value: z.number(),
  unit: z.string(),
  working: workingSchema,
});
export type Figure = z.infer<typeof figureSchema>;

export const headroomStatuses = ['over', 'tight', 'ok'] as const;
export type HeadroomStatus = (typeof headroomStatuses)[number];
export const headroomStatusLabels: Record<HeadroomStatus | 'unknown', string> = {
  over: 'Over',
  tight: 'Tight',
  ok: 'OK',
  unknown: 'Unknown',
};

export const requirementKeys = [
  'crankPower',
  'wheelPower',
  'crankPowerKw',
  'crankTorque',
  'crankTorqueNm',
  'crankTorqueAtPeakPower',
  'fuelMassFlow',
  'fuelVolumeFlow',
  'fuelVolumeFlowGalPerH',
  'injectorDelivery',
  'airMassFlow',
  'lambda',
] as const;
export type RequirementKey = (typeof requirementKeys)[number];

/**
 * Something a reader must know to read a part's figures right:
 * - torque-curve-scaled: the torque target (above the torque at peak power) loads the part,
 *   so the power it supports assumes the whole torque curve scales with power;
 * - return-flow-not-counted: a fuel-supply rating is compared with the fuel burned only.
 */
export const componentNoteCodes = ['torque-curve-scaled', 'return-flow-not-counted'] as const;
export const componentNoteSchema = z.object({
  code: z.enum(componentNoteCodes),
  message: z.string(),
});
export type ComponentNote = z.infer<typeof componentNoteSchema>;

export const componentResultSchema = z.object({
  id: z.string(),
  name: z.string(),
  category: z.enum(partCategories),
  quantity: z.number(),
  ratingValue: z.number(),
  ratingUnit: z.enum(ratingUnits),
  ratingFor: z.string().optional(),
  /** True where the rating is per unit and identical units share the load (flow ratings). */
  quantityMultiplies: z.boolean(),
  /** The requirement this part is compared against. */
  comparedWith: z.enum(requirementKeys),
  capacity: figureSchema,
  requirement: figureSchema,
  headroomPct: figureSchema,
  status: z.enum(headroomStatuses),
  supportedCrankPower: figureSchema,
  notes: z.array(componentNoteSchema),
  /** A part a shop may not see (see estimateComponentSchema): no link to the ledger. */
  anonymised: z.boolean().optional(),
});
export type ComponentResult = z.infer<typeof componentResultSchema>;

export const warningCodes = [
  'target-exceeds-bottom-end',
  'part-over',
  'part-tight',
  'no-bottom-end-rating',
  'no-rated-parts',
  'rating-unusable',
] as const;
export type WarningCode = (typeof warningCodes)[number];

export const warningSchema = z.object({
  code: z.enum(warningCodes),
  severity: z.enum(['danger', 'warning', 'info']),
  message: z.string(),
  componentId: z.string().optional(),
  category: z.enum(partCategories).optional(),
  /**
   * How far the requirement is past the rating: in the part's unit, in crank hp, and in %
   * of the requirement, the basis headroom uses too, so pct = −headroom %:
   * (requirement − capacity) ÷ requirement × 100.
   */
  shortfall: z
    .object({ value: z.number(), unit: z.string(), pct: z.number(), crankHp: z.number() })
    .optional(),
});
export type EstimateWarning = z.infer<typeof warningSchema>;

export const resolvedAssumptionSchema = z.object({
  key: z.string(),
  label: z.string(),
  value: z.number(),
  unit: z.string(),
  default: z.number(),
  min: z.number(),
  max: z.number(),
  isDefault: z.boolean(),
  source: z.string(),
});

export const estimateResultSchema = z.object({
  target: z.object({
    powerHp: z.number(),
    basis: z.enum(powerBases),
    torqueLbft: z.number().nullable(),
  }),
  assumptions: z.object({
    bsfc: z.number(),
    bsfcUnit: z.enum(bsfcUnits),
    bsfcLbPerHpH: z.number(),
    bsfcGPerKwh: z.number(),
    afr: z.number(),
    fuelDensityKgPerL: z.number(),
    drivetrainLossPct: z.number(),
    peakRpm: z.number(),
    cylinders: z.number(),
    /** Whether the cylinder count is the build's own or an assumption of the request. */
    cylindersFrom: z.enum(['build', 'assumption']),
    tightMarginPct: z.number(),
  }),
  /** Each assumption with its default, range and source, for the page. */
  assumptionDetails: z.array(resolvedAssumptionSchema),
  requirements: z.record(z.enum(requirementKeys), figureSchema),
  components: z.array(componentResultSchema),
  weakestLink: z
    .object({
      componentId: z.string(),
      name: z.string(),
      category: z.enum(partCategories),
      headroomPct: z.number(),
      status: z.enum(headroomStatuses),
      message: z.string(),
    })
    .nullable(),
  /** The most the rated parts support; null when no part is rated. Unknown categories do not limit it. */
  supported: z
    .object({
      crankPower: figureSchema,
      wheelPower: figureSchema,
      limitedBy: z.string(),
    })
    .nullable(),
  categories: z.array(
    z.object({
      category: z.enum(partCategories),
      status: z.enum([...headroomStatuses, 'unknown']),
      componentIds: z.array(z.string()),
    }),
  ),
  /** Categories with no rated part: their capacity is not known, not fine. */
  unknownCategories: z.array(z.enum(partCategories)),
  warnings: z.array(warningSchema),
});
export type EstimateResult = z.infer<typeof estimateResultSchema>;
