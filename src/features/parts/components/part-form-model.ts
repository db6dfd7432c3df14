import type { DefaultValues, FieldErrors, Path, Resolver } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import type { z } from 'zod';
import {
  createPartInputSchema,
  partConsistencyIssues,
  partProgressFields,
  updatePartInputSchema,
  type Part,
} from '@shared/schemas/parts';
import { parseNumber } from '@shared/numbers';

/*
 * The part form's model: the values it holds, its fields by section, the conversions from a
 * saved part, and the resolver that checks it as the server will.
 */

export type PartFormInput = z.input<typeof createPartInputSchema>;
export type PartFormValues = z.output<typeof createPartInputSchema>;

/**
 * create: a new part (owner). edit: every field of a part (owner). progress: only its status
 * and dates, which is what crew and shops may change.
 */
export type PartFormMode = 'create' | 'edit' | 'progress';

export const allFields = Object.keys(createPartInputSchema.shape) as Path<PartFormInput>[];
export const progressFields: readonly Path<PartFormInput>[] = partProgressFields;

export const moneyFields = [
  ['unitPriceCents', 'Unit price', 'Each, before tax'],
  ['labourCents', 'Labor', 'Fitting, machining, a shop’s rebuild'],
  ['shippingCents', 'Shipping', undefined],
  ['taxCents', 'Tax', undefined],
  ['coreChargeCents', 'Core charge', 'Paid until the old part goes back'],
  ['coreRefundCents', 'Core refund', 'Received back so far'],
] as const;

export const dateFields = [
  ['orderedOn', 'Ordered'],
  ['expectedOn', 'Expected'],
  ['receivedOn', 'Received'],
  ['sentOutOn', 'Sent to a shop'],
  ['backOn', 'Back from the shop'],
  ['installedOn', 'Installed'],
] as const;

export const emptyToNull = (v: unknown) => (v === '' || v === undefined || v === null ? null : v);
export const toNumberOrUndefined = (v: unknown) => parseNumber(v) ?? undefined;

export function partToFormValues(part: Part): DefaultValues<PartFormInput> {
  return {
    category: part.category,
    name: part.name,
    vendor: part.vendor,
    partNumber: part.partNumber,
    quantity: part.quantity,
    status: part.status,
    shopUserId: part.shopUserId,
    turnaroundDays: part.turnaroundDays,
    unitPriceCents: part.unitPriceCents || undefined,
    labourCents: part.labourCents || undefined,
    shippingCents: part.shippingCents || undefined,
    taxCents: part.taxCents || undefined,
    coreChargeCents: part.coreChargeCents || undefined,
    coreRefundCents: part.coreRefundCents || undefined,
    orderedOn: part.orderedOn,
    expectedOn: part.expectedOn,
    receivedOn: part.receivedOn,
    sentOutOn: part.sentOutOn,
    backOn: part.backOn,
    installedOn: part.installedOn,
    notes: part.notes,
    ratingValue: part.ratingValue,
    ratingUnit: part.ratingUnit,
    ratingFor: part.ratingFor,
  };
}

export const newPartDefaults: DefaultValues<PartFormInput> = {
  category: '' as PartFormInput['category'],
  name: '',
  vendor: '',
  partNumber: '',
  quantity: 1,
  status: 'planned',
  shopUserId: null,
  turnaroundDays: null,
  orderedOn: null,
  expectedOn: null,
  receivedOn: null,
  sentOutOn: null,
  backOn: null,
  installedOn: null,
  notes: '',
  ratingValue: null,
  ratingUnit: null,
  ratingFor: '',
};

export function pick<T extends object>(values: T, keys: readonly string[]): Partial<T> {
  const out: Partial<T> = {};
  for (const key of keys) {
    if (key in values)
      (out as Record<string, unknown>)[key] = (values as Record<string, unknown>)[key];
  }
  return out;
}

/**
 * The shared zod schema first (create, or the partial update schema), then the same
 * cross-field checks the server makes (dates in order, rating value with its unit, refund
 * not above the charge), on the part as it will be after the change.
 */
export function partResolver(
  mode: PartFormMode,
  existing?: Part,
): Resolver<PartFormInput, unknown, PartFormValues> {
  const schemaResolver = (mode === 'create'
    ? zodResolver(createPartInputSchema)
    : zodResolver(updatePartInputSchema)) as unknown as Resolver<
    PartFormInput,
    unknown,
    PartFormValues
  >;
  return async (values, context, options) => {
    const input = mode === 'progress' ? (pick(values, progressFields) as PartFormInput) : values;
    const result = await schemaResolver(input, context, options);
    // Checked on the typed values even when other fields still fail, so every problem shows
    // at once; an unreadable amount (NaN) simply compares false.
    const merged = {
      ...(existing ?? {}),
      ...(Object.keys(result.errors).length ? input : result.values),
    };
    const issues = partConsistencyIssues(merged as Parameters<typeof partConsistencyIssues>[0]);
    const fields = Object.keys(issues).filter(
      (f) =>
        (mode === 'progress' ? progressFields : allFields).includes(f as Path<PartFormInput>) &&
        !(f in result.errors),
    );
    if (!fields.length) return result;
    const errors: FieldErrors<PartFormInput> = { ...result.errors };
    for (const f of fields) {
      (errors as Record<string, { type: string; message: string }>)[f] = {
        type: 'consistency',
        message: issues[f],
      };
    }
    return { values: {}, errors };
  };
}
