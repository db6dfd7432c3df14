import type { ReactNode } from 'react';
import { Controller, useForm, type DefaultValues, type Path } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import type { z } from 'zod';
import {
  aspirationLabels,
  aspirations,
  createBuildInputSchema,
  powerBases,
  powerBasisLabels,
  type Build,
} from '@shared/schemas/builds';
import { currencies } from '@shared/schemas/common';
import { parseNumber } from '@shared/numbers';
import { FormActions } from '@/components/ui/form-actions';
import { FieldGroup, FormField, SelectInput, TextInput } from '@/components/ui/form-field';
import { MoneyInput } from '@/components/ui/money-input';
import { NumberInput } from '@/components/ui/number-input';
import { applyServerErrors } from '@/lib/form-errors';

// Create and edit validate with the same schema the server uses for create: an edit sends
// every field, which the server's partial update schema accepts as well.
const schema = createBuildInputSchema;
export type BuildFormInput = z.input<typeof schema>;
export type BuildFormValues = z.output<typeof schema>;

const fieldNames = Object.keys(schema.shape) as Path<BuildFormInput>[];

function toDateOrNull(value: unknown): string | null {
  return value === null || value === undefined || value === '' ? null : String(value);
}

export const newBuildDefaults: DefaultValues<BuildFormInput> = {
  name: '',
  vehicleYear: null,
  vehicleDescription: '',
  engineDescription: '',
  displacementLiters: null,
  aspiration: 'single-turbo',
  transmission: '',
  stockPowerHp: null,
  stockPowerBasis: 'crank',
  targetPowerBasis: 'crank',
  targetTorqueLbft: null,
  targetDate: null,
  targetEvent: '',
  currency: 'USD',
};

/** The editable fields of a build as the form holds them (nothing else: the schema is strict). */
export function buildToFormValues(build: Build): DefaultValues<BuildFormInput> {
  return {
    name: build.name,
    vehicleYear: build.vehicleYear,
    vehicleDescription: build.vehicleDescription ?? '',
    engineDescription: build.engineDescription ?? '',
    displacementLiters: build.displacementLiters,
    cylinders: build.cylinders,
    aspiration: build.aspiration,
    transmission: build.transmission ?? '',
    stockPowerHp: build.stockPowerHp,
    stockPowerBasis: build.stockPowerBasis ?? 'crank',
    targetPowerHp: build.targetPowerHp,
    targetPowerBasis: build.targetPowerBasis,
    targetTorqueLbft: build.targetTorqueLbft,
    targetDate: build.targetDate,
    targetEvent: build.targetEvent ?? '',
    // The server stores "no budget" as 0; show it as an empty box.
    budgetCents: build.budgetCents ? build.budgetCents : undefined,
    currency: build.currency,
  };
}

export function BuildForm({
  defaultValues,
  submitLabel,
  cancelHref,
  onSubmit,
  intro,
}: {
  defaultValues: DefaultValues<BuildFormInput>;
  submitLabel: string;
  cancelHref: string;
  onSubmit: (values: BuildFormValues) => Promise<unknown>;
  intro?: ReactNode;
}) {
  const {
    register,
    handleSubmit,
    control,
    watch,
    setError,
    formState: { errors, isSubmitting },
  } = useForm<BuildFormInput, unknown, BuildFormValues>({
    resolver: zodResolver(schema),
    defaultValues,
    mode: 'onTouched',
  });
  const currency = watch('currency') ?? 'USD';
  // NaN means the budget box holds text that is not an amount; say how to write one.
  const budgetUnreadable = Number.isNaN(watch('budgetCents'));

  const submit = handleSubmit(async (values) => {
    try {
      // An empty budget box means "no budget", which the API stores as 0. Sending 0 rather
      // than leaving the field out lets an edit clear a budget that was set before.
      await onSubmit({ ...values, budgetCents: values.budgetCents ?? 0 });
    } catch (error) {
      applyServerErrors(error, setError, fieldNames);
    }
  });

  const numeric = { setValueAs: parseNumber };

  return (
    <form onSubmit={submit} noValidate className="flex flex-col gap-5">
      {intro}

      <FieldGroup legend="The build">
        <FormField
          label="Build name"
          error={errors.name?.message}
          className="sm:col-span-2"
          hint="What you call it, e.g. “Pull truck 2027”"
        >
          {(c) => <TextInput {...c} {...register('name')} autoComplete="off" />}
        </FormField>
      </FieldGroup>

      <FieldGroup legend="Truck">
        <FormField label="Model year" optional error={errors.vehicleYear?.message}>
          {(c) => <NumberInput {...c} {...register('vehicleYear', numeric)} integer />}
        </FormField>
        <FormField
          label="Vehicle"
          optional
          error={errors.vehicleDescription?.message}
          hint="Size, cab and drive, e.g. one-ton crew cab 4x4"
        >
          {(c) => <TextInput {...c} {...register('vehicleDescription')} autoComplete="off" />}
        </FormField>
        <FormField
          label="Engine"
          optional
          error={errors.engineDescription?.message}
          hint="e.g. 6.7 L inline-six, common rail"
          className="sm:col-span-2"
        >
          {(c) => <TextInput {...c} {...register('engineDescription')} autoComplete="off" />}
        </FormField>
        <div className="grid grid-cols-2 gap-4 sm:col-span-2 sm:grid-cols-3">
          <FormField label="Displacement" optional error={errors.displacementLiters?.message}>
            {(c) => <NumberInput {...c} {...register('displacementLiters', numeric)} unit="L" />}
          </FormField>
          <FormField label="Cylinders" error={errors.cylinders?.message}>
            {(c) => <NumberInput {...c} {...register('cylinders', numeric)} integer />}
          </FormField>
          <FormField
            label="Aspiration"
            error={errors.aspiration?.message}
            className="col-span-2 sm:col-span-1"
          >
            {(c) => (
              <SelectInput {...c} {...register('aspiration')}>
                {aspirations.map((value) => (
                  <option key={value} value={value}>
                    {aspirationLabels[value]}
                  </option>
                ))}
              </SelectInput>
            )}
          </FormField>
        </div>
        <FormField
          label="Transmission"
          optional
          error={errors.transmission?.message}
          hint="e.g. six-speed automatic, billet input shaft, triple-disc converter"
          className="sm:col-span-2"
        >
          {(c) => <TextInput {...c} {...register('transmission')} autoComplete="off" />}
        </FormField>
      </FieldGroup>

      <FieldGroup
        legend="Power"
        description="Say where each figure is measured: at the crank, or at the wheels on a chassis dyno."
      >
        <div className="grid grid-cols-2 gap-4 sm:col-span-2">
          <FormField label="Stock power" optional error={errors.stockPowerHp?.message}>
            {(c) => <NumberInput {...c} {...register('stockPowerHp', numeric)} unit="hp" />}
          </FormField>
          <FormField label="Stock basis" error={errors.stockPowerBasis?.message}>
            {(c) => (
              <SelectInput {...c} {...register('stockPowerBasis')}>
                {powerBases.map((value) => (
                  <option key={value} value={value}>
                    {powerBasisLabels[value]}
                  </option>
                ))}
              </SelectInput>
            )}
          </FormField>
        </div>
        <div className="grid grid-cols-2 gap-4 sm:col-span-2">
          <FormField label="Target power" error={errors.targetPowerHp?.message}>
            {(c) => <NumberInput {...c} {...register('targetPowerHp', numeric)} unit="hp" />}
          </FormField>
          <FormField label="Target basis" error={errors.targetPowerBasis?.message}>
            {(c) => (
              <SelectInput {...c} {...register('targetPowerBasis')}>
                {powerBases.map((value) => (
                  <option key={value} value={value}>
                    {powerBasisLabels[value]}
                  </option>
                ))}
              </SelectInput>
            )}
          </FormField>
        </div>
        <FormField label="Target torque" optional error={errors.targetTorqueLbft?.message}>
          {(c) => <NumberInput {...c} {...register('targetTorqueLbft', numeric)} unit="lbf·ft" />}
        </FormField>
      </FieldGroup>

      <FieldGroup legend="Deadline">
        <FormField label="Target date" optional error={errors.targetDate?.message}>
          {(c) => (
            <TextInput
              {...c}
              {...register('targetDate', { setValueAs: toDateOrNull })}
              type="date"
            />
          )}
        </FormField>
        <FormField
          label="Event"
          optional
          error={errors.targetEvent?.message}
          hint="A show, a pull, a dyno day"
        >
          {(c) => <TextInput {...c} {...register('targetEvent')} autoComplete="off" />}
        </FormField>
      </FieldGroup>

      <FieldGroup legend="Money" description="Only owners of the build ever see money.">
        <FormField
          label="Budget"
          optional
          error={
            errors.budgetCents &&
            (budgetUnreadable
              ? `Enter an amount like 18500.00 (at most two decimals)`
              : errors.budgetCents.message)
          }
          hint={`In ${currency}, e.g. 18500.00`}
        >
          {(c) => (
            <Controller
              control={control}
              name="budgetCents"
              render={({ field }) => (
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
            />
          )}
        </FormField>
        <FormField label="Currency" error={errors.currency?.message}>
          {(c) => (
            <SelectInput {...c} {...register('currency')}>
              {currencies.map((code) => (
                <option key={code} value={code}>
                  {code}
                </option>
              ))}
            </SelectInput>
          )}
        </FormField>
      </FieldGroup>

      <FormActions
        error={errors.root?.server?.message}
        cancelHref={cancelHref}
        submitLabel={submitLabel}
        pending={isSubmitting}
      />
    </form>
  );
}
