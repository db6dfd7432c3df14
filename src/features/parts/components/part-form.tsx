import { useEffect } from 'react';
import { useForm } from 'react-hook-form';
import type { Part, UpdatePartInput } from '@shared/schemas/parts';
import { FormActions } from '@/components/ui/form-actions';
import { applyServerErrors } from '@/lib/form-errors';
import {
  allFields,
  moneyFields,
  newPartDefaults,
  partResolver,
  partToFormValues,
  pick,
  progressFields,
  type PartFormInput,
  type PartFormMode,
  type PartFormValues,
} from './part-form-model';
import {
  DatesSection,
  MoneySection,
  NotesSection,
  PartDetailsSection,
  RatingSection,
  StatusSection,
  WhereItIsSection,
} from './part-form-sections';

export type { PartFormMode } from './part-form-model';

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

  const sectionProps = { register, errors };

  return (
    <form onSubmit={submit} noValidate className="flex flex-col gap-5">
      {progressOnly ? (
        <StatusSection {...sectionProps} />
      ) : (
        <>
          <PartDetailsSection {...sectionProps} />
          <WhereItIsSection
            {...sectionProps}
            shops={shops}
            showShop={status === 'at-shop' || Boolean(shopId) || turnaround != null}
          />
        </>
      )}

      <DatesSection {...sectionProps} />

      {!progressOnly && (
        <>
          <MoneySection control={control} errors={errors} currency={currency} />
          <RatingSection {...sectionProps} />
          <NotesSection {...sectionProps} />
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
