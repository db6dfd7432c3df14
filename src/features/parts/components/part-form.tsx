import { useEffect } from 'react';
import {
  Controller,
  useForm,
  type Control,
  type DefaultValues,
  type FieldErrors,
  type Path,
  type Resolver,
} from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import type { z } from 'zod';
import {
  createPartInputSchema,
  partCategories,
  partCategoryLabels,
  partConsistencyIssues,
  partProgressFields,
  partStatuses,
  partStatusLabels,
  ratingUnitLabels,
  ratingUnits,
  updatePartInputSchema,
  type Part,
  type UpdatePartInput,
} from '../../../../shared/schemas/parts';
import { parseNumber } from '../../../../shared/numbers';
import { FormActions } from '../../../components/ui/form-actions';
import {
  FieldGroup,
  FormField,
  SelectInput,
  TextArea,
  TextInput,
} from '../../../components/ui/form-field';
import { MoneyInput } from '../../../components/ui/money-input';
import { NumberInput } from '../../../components/ui/number-input';
import { applyServerErrors } from '../../../lib/form-errors';

export type PartFormInput = z.input<typeof createPartInputSchema>;
export type PartFormValues = z.output<typeof createPartInputSchema>;

/**
 * create: a new part (owner). edit: every field of a part (owner). progress: only its status
 * and dates, which is what crew and shops may change.
 */
export type PartFormMode = 'create' | 'edit' | 'progress';

const allFields = Object.keys(createPartInputSchema.shape) as Path<PartFormInput>[];
const progressFields: readonly Path<PartFormInput>[] = partProgressFields;

const moneyFields = [
  ['unitPriceCents', 'Unit price', 'Each, before tax'],
  ['labourCents', 'Labor', 'Fitting, machining, a shop’s rebuild'],
  ['shippingCents', 'Shipping', undefined],
  ['taxCents', 'Tax', undefined],
  ['coreChargeCents', 'Core charge', 'Paid until the old part goes back'],
  ['coreRefundCents', 'Core refund', 'Received back so far'],
] as const;

const dateFields = [
  ['orderedOn', 'Ordered'],
  ['expectedOn', 'Expected'],
  ['receivedOn', 'Received'],
  ['sentOutOn', 'Sent to a shop'],
  ['backOn', 'Back from the shop'],
  ['installedOn', 'Installed'],
] as const;

const emptyToNull = (v: unknown) => (v === '' || v === undefined || v === null ? null : v);
const toNumberOrUndefined = (v: unknown) => parseNumber(v) ?? undefined;

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

function pick<T extends object>(values: T, keys: readonly string[]): Partial<T> {
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
function partResolver(
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

function MoneyField({
  control,
  name,
  label,
  hint,
  currency,
  error,
}: {
  control: Control<PartFormInput, unknown, PartFormValues>;
  name: (typeof moneyFields)[number][0];
  label: string;
  hint?: string;
  currency: string;
  error?: string;
}) {
  return (
    <Controller
      control={control}
      name={name}
      render={({ field }) => (
        <FormField
          label={label}
          optional
          hint={hint}
          error={
            error &&
            (Number.isNaN(field.value)
              ? 'Enter an amount like 1234.56 (at most two decimals)'
              : error)
          }
        >
          {(c) => (
            <MoneyInput
              {...c}
              ref={field.ref}
              name={field.name}
              value={field.value}
              onChange={field.onChange}
              onBlur={field.onBlur}
              currency={currency}
            />
          )}
        </FormField>
      )}
    />
  );
}

export function PartForm({
  mode,
  part,
  currency,
  shops,
  submitLabel,
  onSubmit,
  onCancel,
  focusRating = false,
}: {
  mode: PartFormMode;
  part?: Part;
  currency: string;
  /** Shop members of the build, to say who a part is out with (owner forms only). */
  shops: { userId: string; displayName: string }[];
  submitLabel: string;
  onSubmit: (values: UpdatePartInput) => Promise<unknown>;
  onCancel: () => void;
  /** Opened from "change its rating" on the estimate: start at the rated value. */
  focusRating?: boolean;
}) {
  const progressOnly = mode === 'progress';
  const {
    register,
    handleSubmit,
    control,
    watch,
    setError,
    setFocus,
    formState: { errors, isSubmitting },
  } = useForm<PartFormInput, unknown, PartFormValues>({
    resolver: partResolver(mode, part),
    defaultValues: part
      ? progressOnly
        ? pick(partToFormValues(part), progressFields)
        : partToFormValues(part)
      : newPartDefaults,
    mode: 'onTouched',
  });
  useEffect(() => {
    if (!focusRating) return;
    // After the dialog has opened (showModal focuses its first control).
    const frame = requestAnimationFrame(() => setFocus('ratingValue', { shouldSelect: true }));
    return () => cancelAnimationFrame(frame);
  }, [focusRating, setFocus]);
  const status = watch('status');
  const shopId = watch('shopUserId');
  const turnaround = watch('turnaroundDays');

  const submit = handleSubmit(async (values) => {
    let input: UpdatePartInput;
    if (progressOnly) {
      input = pick(values, progressFields) as UpdatePartInput;
    } else {
      // An empty money box means none: 0, so an edit can clear an amount set before.
      input = { ...values };
      for (const [key] of moneyFields) input[key] = values[key] ?? 0;
    }
    try {
      await onSubmit(input);
    } catch (error) {
      applyServerErrors(error, setError, progressOnly ? progressFields : allFields);
    }
  });

  const numeric = { setValueAs: parseNumber };
  const dates = (
    <FieldGroup
      legend="Dates"
      description="Leave a date empty until it happens. Each date must come after the one before it."
    >
      {dateFields.map(([name, label]) => (
        <FormField key={name} label={label} optional error={errors[name]?.message}>
          {(c) => <TextInput {...c} {...register(name, { setValueAs: emptyToNull })} type="date" />}
        </FormField>
      ))}
    </FieldGroup>
  );

  return (
    <form onSubmit={submit} noValidate className="flex flex-col gap-5">
      {progressOnly ? (
        <FieldGroup legend="Where it is">
          <FormField label="Status" error={errors.status?.message} className="sm:col-span-2">
            {(c) => (
              <SelectInput {...c} {...register('status')}>
                {partStatuses.map((s) => (
                  <option key={s} value={s}>
                    {partStatusLabels[s]}
                  </option>
                ))}
              </SelectInput>
            )}
          </FormField>
        </FieldGroup>
      ) : (
        <>
          <FieldGroup legend="The part">
            <FormField label="Name" error={errors.name?.message} className="sm:col-span-2">
              {(c) => (
                <TextInput
                  {...c}
                  {...register('name')}
                  autoComplete="off"
                  placeholder="e.g. Head studs, 12-point, 1/2-inch"
                />
              )}
            </FormField>
            <FormField label="Category" error={errors.category?.message}>
              {(c) => (
                <SelectInput {...c} {...register('category')}>
                  <option value="" disabled>
                    Choose a category
                  </option>
                  {partCategories.map((value) => (
                    <option key={value} value={value}>
                      {partCategoryLabels[value]}
                    </option>
                  ))}
                </SelectInput>
              )}
            </FormField>
            <FormField label="Quantity" error={errors.quantity?.message}>
              {(c) => (
                <NumberInput
                  {...c}
                  {...register('quantity', { setValueAs: toNumberOrUndefined })}
                  integer
                />
              )}
            </FormField>
            <FormField label="Vendor" optional error={errors.vendor?.message}>
              {(c) => <TextInput {...c} {...register('vendor')} autoComplete="off" />}
            </FormField>
            <FormField label="Part number" optional error={errors.partNumber?.message}>
              {(c) => <TextInput {...c} {...register('partNumber')} autoComplete="off" />}
            </FormField>
          </FieldGroup>

          <FieldGroup legend="Where it is">
            <FormField label="Status" error={errors.status?.message}>
              {(c) => (
                <SelectInput {...c} {...register('status')}>
                  {partStatuses.map((s) => (
                    <option key={s} value={s}>
                      {partStatusLabels[s]}
                    </option>
                  ))}
                </SelectInput>
              )}
            </FormField>
            {(status === 'at-shop' || shopId || turnaround != null) && (
              <>
                <FormField
                  label="Shop"
                  optional
                  error={errors.shopUserId?.message}
                  hint={
                    shops.length === 0
                      ? 'Add the shop to the build as a member with the Shop role to choose it here.'
                      : 'The shop member sees this part and its labor quote, nothing else.'
                  }
                >
                  {(c) => (
                    <SelectInput {...c} {...register('shopUserId', { setValueAs: emptyToNull })}>
                      <option value="">No shop chosen</option>
                      {shops.map((s) => (
                        <option key={s.userId} value={s.userId}>
                          {s.displayName}
                        </option>
                      ))}
                    </SelectInput>
                  )}
                </FormField>
                <FormField
                  label="Promised turnaround"
                  optional
                  error={errors.turnaroundDays?.message}
                  hint="Days the shop said it would take"
                >
                  {(c) => (
                    <NumberInput
                      {...c}
                      {...register('turnaroundDays', numeric)}
                      unit="days"
                      integer
                    />
                  )}
                </FormField>
              </>
            )}
          </FieldGroup>
        </>
      )}

      {dates}

      {!progressOnly && (
        <>
          <FieldGroup
            legend="Money"
            description={`Amounts in ${currency}. Only owners of the build ever see money; a shop sees its own labor quote.`}
          >
            {moneyFields.map(([name, label, hint]) => (
              <MoneyField
                key={name}
                control={control}
                name={name}
                label={label}
                hint={hint}
                currency={currency}
                error={errors[name]?.message}
              />
            ))}
          </FieldGroup>

          <FieldGroup
            legend="Rating"
            description="What the maker says the part can take; the power estimate checks the build against it."
          >
            <FormField label="Rated value" optional error={errors.ratingValue?.message}>
              {(c) => <NumberInput {...c} {...register('ratingValue', numeric)} />}
            </FormField>
            <FormField label="Rating unit" optional error={errors.ratingUnit?.message}>
              {(c) => (
                <SelectInput {...c} {...register('ratingUnit', { setValueAs: emptyToNull })}>
                  <option value="">No rating</option>
                  {ratingUnits.map((u) => (
                    <option key={u} value={u}>
                      {ratingUnitLabels[u]}
                    </option>
                  ))}
                </SelectInput>
              )}
            </FormField>
            <FormField
              label="Rated for"
              optional
              error={errors.ratingFor?.message}
              hint="e.g. input torque, builder’s rating"
              className="sm:col-span-2"
            >
              {(c) => <TextInput {...c} {...register('ratingFor')} autoComplete="off" />}
            </FormField>
          </FieldGroup>

          <FieldGroup legend="Notes">
            <FormField
              label="Notes"
              optional
              error={errors.notes?.message}
              className="sm:col-span-2"
            >
              {(c) => <TextArea {...c} {...register('notes')} rows={3} />}
            </FormField>
          </FieldGroup>
        </>
      )}

      <FormActions
        layout="sticky"
        error={errors.root?.server?.message}
        onCancel={onCancel}
        submitLabel={submitLabel}
        pending={isSubmitting}
      />
    </form>
  );
}
