import { Controller, type Control, type FieldErrors, type UseFormRegister } from 'react-hook-form';
import {
  partCategories,
  partCategoryLabels,
  partStatuses,
  partStatusLabels,
  ratingUnitLabels,
  ratingUnits,
} from '@shared/schemas/parts';
import { parseNumber } from '@shared/numbers';
import {
  FieldGroup,
  FormField,
  SelectInput,
  TextArea,
  TextInput,
} from '@/components/ui/form-field';
import { MoneyInput } from '@/components/ui/money-input';
import { NumberInput } from '@/components/ui/number-input';
import {
  dateFields,
  emptyToNull,
  moneyFields,
  toNumberOrUndefined,
  type PartFormInput,
  type PartFormValues,
} from './part-form-model';

/* The part form's sections, each a titled group of fields. */

type SectionProps = {
  register: UseFormRegister<PartFormInput>;
  errors: FieldErrors<PartFormInput>;
};

const numeric = { setValueAs: parseNumber };

/** Name, category, quantity, vendor and part number. */
export function PartDetailsSection({ register, errors }: SectionProps) {
  return (
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
  );
}

/** Status only: what crew and shops may change. */
export function StatusSection({ register, errors }: SectionProps) {
  return (
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
  );
}

/** Status, and the shop with its promised turnaround once the part goes out (or has a shop). */
export function WhereItIsSection({
  register,
  errors,
  showShop,
  shops,
}: SectionProps & { showShop: boolean; shops: { userId: string; displayName: string }[] }) {
  return (
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
      {showShop && (
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
              <NumberInput {...c} {...register('turnaroundDays', numeric)} unit="days" integer />
            )}
          </FormField>
        </>
      )}
    </FieldGroup>
  );
}

/** The six dates of a part's life, each after the one before. */
export function DatesSection({ register, errors }: SectionProps) {
  return (
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

/** Price, labor, shipping, tax and the core charge with its refund, in the build's currency. */
export function MoneySection({
  control,
  errors,
  currency,
}: {
  control: Control<PartFormInput, unknown, PartFormValues>;
  errors: FieldErrors<PartFormInput>;
  currency: string;
}) {
  return (
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
  );
}

/** What the maker says the part can take: value, unit and what for. */
export function RatingSection({ register, errors }: SectionProps) {
  return (
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
  );
}

export function NotesSection({ register, errors }: SectionProps) {
  return (
    <FieldGroup legend="Notes">
      <FormField label="Notes" optional error={errors.notes?.message} className="sm:col-span-2">
        {(c) => <TextArea {...c} {...register('notes')} rows={3} />}
      </FormField>
    </FieldGroup>
  );
}
