import { z } from 'zod';
import { centsSchema, idSchema, isoDateSchema, trimmed } from './common';
import { hasAtMostDecimals } from './precision';

/** Part categories: the trade's own words where it has them. */
export const partCategories = [
  'fuel-injection',
  'fuel-supply',
  'turbocharger',
  'air-intake',
  'exhaust',
  'head-and-studs',
  'bottom-end',
  'transmission',
  'torque-converter',
  'driveline',
  'cooling',
  'tuning',
  'other',
] as const;
export type PartCategory = (typeof partCategories)[number];
export const partCategoryLabels: Record<PartCategory, string> = {
  'fuel-injection': 'Fuel injection',
  'fuel-supply': 'Fuel supply',
  turbocharger: 'Turbocharger',
  'air-intake': 'Air intake',
  exhaust: 'Exhaust',
  'head-and-studs': 'Cylinder head & studs',
  'bottom-end': 'Bottom end',
  transmission: 'Transmission',
  'torque-converter': 'Torque converter',
  driveline: 'Driveline',
  cooling: 'Cooling',
  tuning: 'Tuning & electronics',
  other: 'Other',
};

/** Where a part is in its life. planned → ordered → in-hand → at-shop → installed; or returned. */
export const partStatuses = [
  'planned',
  'ordered',
  'in-hand',
  'at-shop',
  'installed',
  'returned',
] as const;
export type PartStatus = (typeof partStatuses)[number];
export const partStatusLabels: Record<PartStatus, string> = {
  planned: 'On the list',
  ordered: 'On order',
  'in-hand': 'In the garage',
  'at-shop': 'Out at a shop',
  installed: 'On the truck',
  returned: 'Sent back',
};

/** Units a maker's rating can be declared in. */
export const ratingUnits = [
  'hp-crank',
  'hp-wheel',
  'kw',
  'lbf-ft',
  'n-m',
  'mm3-per-stroke',
  'lb-per-min',
  'l-per-h',
  'gal-per-h',
] as const;
export type RatingUnit = (typeof ratingUnits)[number];
export const ratingUnitLabels: Record<RatingUnit, string> = {
  'hp-crank': 'crank hp',
  'hp-wheel': 'wheel hp',
  kw: 'kW (crank)',
  'lbf-ft': 'lbf·ft',
  'n-m': 'N·m',
  'mm3-per-stroke': 'mm³/stroke',
  'lb-per-min': 'lb/min air',
  'l-per-h': 'L/h',
  'gal-per-h': 'US gal/h',
};

const nullableDate = isoDateSchema.nullable().optional();
const nullableCents = centsSchema.optional();

export const partFieldsSchema = z.object({
  category: z.enum(partCategories, { message: 'Choose a category from the list' }),
  name: trimmed(160, 'Name').min(1, { message: 'Name the part' }),
  vendor: trimmed(120, 'Vendor').optional(),
  partNumber: trimmed(80, 'Part number').optional(),
  quantity: z
    .number({ message: 'Enter a quantity' })
    .int({ message: 'Quantity is a whole number' })
    .min(1, { message: 'Quantity is at least 1' })
    .max(10_000, { message: 'Quantity is at most 10000' })
    .optional(),
  status: z.enum(partStatuses, { message: 'Choose a status from the list' }).optional(),
  /** The shop member the part is out with, while at-shop. */
  shopUserId: idSchema.nullable().optional(),
  turnaroundDays: z
    .number({ message: 'Enter days' })
    .int({ message: 'Whole days' })
    .min(0, { message: 'Days cannot be negative' })
    .max(365, { message: 'At most 365 days' })
    .nullable()
    .optional(),
  unitPriceCents: nullableCents,
  labourCents: nullableCents,
  shippingCents: nullableCents,
  taxCents: nullableCents,
  coreChargeCents: nullableCents,
  coreRefundCents: nullableCents,
  orderedOn: nullableDate,
  expectedOn: nullableDate,
  receivedOn: nullableDate,
  sentOutOn: nullableDate,
  backOn: nullableDate,
  installedOn: nullableDate,
  notes: trimmed(4000, 'Notes').optional(),
  // The ledger keeps ratings to 0.001 (numeric(12,3)); more decimals, or a rating under
  // 0.0005 that would be stored as 0, are refused rather than changed.
  ratingValue: z
    .number({ message: 'Enter the rated value' })
    .positive({ message: 'A rating is above zero' })
    .max(100_000, { message: 'That rating is too large' })
    .refine((v) => hasAtMostDecimals(v, 3), {
      message: 'Round to three decimal places: the ledger keeps ratings to 0.001',
    })
    .nullable()
    .optional(),
  ratingUnit: z
    .enum(ratingUnits, { message: 'Choose a rating unit from the list' })
    .nullable()
    .optional(),
  ratingFor: trimmed(200, 'Rated for').optional(),
});
export type PartFields = z.infer<typeof partFieldsSchema>;

/** Field-level contradictions in a whole part (after an edit is merged onto it). */
export function partConsistencyIssues(p: Partial<PartFields>): Record<string, string> {
  const issues: Record<string, string> = {};
  const before = (later: keyof PartFields, earlier: keyof PartFields, message: string) => {
    const a = p[later] as string | null | undefined;
    const b = p[earlier] as string | null | undefined;
    if (a && b && a < b) issues[later] ??= message;
  };
  before('expectedOn', 'orderedOn', 'Expected date is before the order date');
  before('receivedOn', 'orderedOn', 'Received before it was ordered');
  before('backOn', 'sentOutOn', 'Back from the shop before it was sent out');
  before('installedOn', 'receivedOn', 'Installed before it was received');
  before('installedOn', 'backOn', 'Installed before it came back from the shop');
  const hasValue = p.ratingValue != null;
  const hasUnit = p.ratingUnit != null;
  if (hasValue && !hasUnit) issues.ratingUnit = 'Choose the unit of the rating';
  if (hasUnit && !hasValue) issues.ratingValue = 'Enter the rated value';
  if ((p.coreRefundCents ?? 0) > (p.coreChargeCents ?? 0)) {
    issues.coreRefundCents = 'The core refund cannot be more than the core charge';
  }
  return issues;
}

export const createPartInputSchema = partFieldsSchema.strict();
export type CreatePartInput = z.infer<typeof createPartInputSchema>;

export const updatePartInputSchema = partFieldsSchema
  .partial()
  .strict()
  .refine((v) => Object.keys(v).length > 0, { message: 'Nothing to change' });
export type UpdatePartInput = z.infer<typeof updatePartInputSchema>;

/** What crew and shops may change on a part: where it is and when. */
export const partProgressFields = [
  'status',
  'orderedOn',
  'expectedOn',
  'receivedOn',
  'sentOutOn',
  'backOn',
  'installedOn',
] as const;

/** A part as the API returns it; money keys are absent for roles that may not see them. */
export type Part = {
  id: string;
  buildId: string;
  category: PartCategory;
  name: string;
  vendor: string;
  partNumber: string;
  quantity: number;
  status: PartStatus;
  shopUserId: string | null;
  shopName: string | null;
  turnaroundDays: number | null;
  unitPriceCents?: number;
  labourCents?: number;
  shippingCents?: number;
  taxCents?: number;
  coreChargeCents?: number;
  coreRefundCents?: number;
  /** price × quantity + labour + shipping + tax + core charge − core refund. */
  totalCents?: number;
  orderedOn: string | null;
  expectedOn: string | null;
  receivedOn: string | null;
  sentOutOn: string | null;
  backOn: string | null;
  installedOn: string | null;
  notes: string;
  ratingValue: number | null;
  ratingUnit: RatingUnit | null;
  ratingFor: string;
  /** For a part out at a shop: days since it went, the promised date and whether that has passed. */
  sendOut: { daysOut: number; dueOn: string | null; overdue: boolean } | null;
  createdAt: string;
  updatedAt: string;
};

export const budgetStages = ['planned', 'committed', 'spent'] as const;

export type BudgetLine = {
  category: PartCategory;
  plannedCents: number;
  committedCents: number;
  spentCents: number;
  coreOwedCents: number;
  partCount: number;
};

export type Budget = {
  currency: string;
  budgetCents: number;
  totals: Omit<BudgetLine, 'category'>;
  categories: BudgetLine[];
  remainingAfterPlannedCents: number;
  remainingAfterSpentCents: number;
  overBudget: boolean;
  /** The part whose cost takes the planned total past the budget, in the order money goes out. */
  tippingPart: { id: string; name: string; overByCents: number } | null;
  /** Cumulative committed money by date (ordered date, else received, else created). */
  spendingOverTime: { date: string; committedCents: number; spentCents: number }[];
};
