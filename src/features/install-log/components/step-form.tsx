import { useEffect, useRef } from 'react';
import { useForm, useWatch, type Path } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import type { z } from 'zod';
import {
  cautionChoiceLabels,
  cautionTexts,
  choosableCautionIds,
  suggestCautions,
} from '@shared/install-log/cautions';
import { createStepInputSchema, type Step } from '@shared/schemas/install-log';
import { partCategoryLabels, type Part } from '@shared/schemas/parts';
import { FormActions } from '@/components/ui/form-actions';
import { FormField, TextArea, TextInput } from '@/components/ui/form-field';
import { applyServerErrors } from '@/lib/form-errors';

type Input = z.input<typeof createStepInputSchema>;
type Values = z.output<typeof createStepInputSchema>;
const fieldNames: Path<Input>[] = ['title', 'description', 'partIds', 'cautions'];

/**
 * A new step: its name, what to do, the parts it fits and the cautions that apply. With
 * `step` given it edits that step's name, what to do and its cautions; its linked parts are
 * left as they are (they are not sent).
 *
 * Cautions: Headroom ticks the ones the parts and words suggest, and keeps doing so as the
 * author types, until the author ticks or unticks one by hand; from then on the ticks are
 * theirs. Each suggestion says why it is suggested.
 */
export function StepForm({
  step,
  parts,
  submitLabel = 'Add step',
  onSubmit,
  onCancel,
}: {
  step?: Pick<Step, 'title' | 'description' | 'cautionChoice' | 'cautions' | 'parts'>;
  /** The build's parts to link; undefined while they load (or when they cannot be read). */
  parts: Part[] | undefined;
  submitLabel?: string;
  onSubmit: (values: Values) => Promise<unknown>;
  onCancel: () => void;
}) {
  const chosenBefore = step
    ? (step.cautionChoice ??
      step.cautions.flatMap((c) => (c.id === 'service-information' ? [] : [c.id])))
    : [];
  const {
    register,
    handleSubmit,
    setError,
    setValue,
    control,
    formState: { errors, isSubmitting },
  } = useForm<Input, unknown, Values>({
    resolver: zodResolver(createStepInputSchema),
    defaultValues: step
      ? { title: step.title, description: step.description, cautions: chosenBefore }
      : { title: '', description: '', partIds: [], cautions: [] },
  });
  // An edited step keeps its ticks; a new one follows the suggestions until touched.
  const touched = useRef(Boolean(step));
  const [title, description, partIds] = useWatch({
    control,
    name: ['title', 'description', 'partIds'],
  });
  const usable = step ? [] : (parts ?? []).filter((p) => p.status !== 'returned');
  const linkedCategories = step
    ? step.parts.map((p) => p.category)
    : usable.filter((p) => (partIds ?? []).includes(p.id)).map((p) => p.category);
  const suggestions = suggestCautions({
    title: title ?? '',
    description: description ?? '',
    partCategories: linkedCategories,
  });
  const suggestedIds = suggestions.map((s) => s.id).join(',');
  useEffect(() => {
    if (!touched.current) {
      setValue('cautions', suggestedIds ? (suggestedIds.split(',') as Values['cautions']) : []);
    }
  }, [suggestedIds, setValue]);

  const submit = handleSubmit(async (values) => {
    try {
      const cautions = values.cautions ?? [];
      if (step) {
        const { title, description } = values;
        await onSubmit({ title, description, cautions });
      } else {
        await onSubmit({ ...values, cautions });
      }
    } catch (error) {
      applyServerErrors(error, setError, fieldNames);
    }
  });
  const cautionField = register('cautions', {
    onChange: () => {
      touched.current = true;
    },
  });

  return (
    <form onSubmit={submit} noValidate className="flex flex-col gap-4">
      <FormField
        label="Step name"
        error={errors.title?.message}
        hint="One piece of the work, e.g. “Seat the injectors and torque the hold-downs”"
      >
        {(c) => <TextInput {...c} {...register('title')} autoComplete="off" autoFocus />}
      </FormField>
      <FormField label="What to do" optional error={errors.description?.message}>
        {(c) => <TextArea {...c} {...register('description')} rows={4} />}
      </FormField>

      {usable.length > 0 && (
        <fieldset className="flex flex-col gap-1">
          <legend className="mb-1 text-[15px] font-semibold">
            Parts this step fits <span className="font-normal text-muted">(optional)</span>
          </legend>
          <div className="flex max-h-72 flex-col overflow-y-auto rounded-md border border-rule-strong bg-white">
            {usable.map((p) => (
              <label
                key={p.id}
                className="flex min-h-12 shrink-0 cursor-pointer items-center gap-3 border-b border-rule px-3 py-2 last:border-b-0"
              >
                <input
                  type="checkbox"
                  value={p.id}
                  {...register('partIds')}
                  className="size-6 shrink-0 accent-accent-600"
                />
                <span className="min-w-0">
                  <span className="block leading-snug">{p.name}</span>
                  <span className="block text-sm text-muted">{partCategoryLabels[p.category]}</span>
                </span>
              </label>
            ))}
          </div>
          {errors.partIds?.message && (
            <p className="text-sm font-semibold text-over">{errors.partIds.message}</p>
          )}
        </fieldset>
      )}

      <fieldset className="flex flex-col gap-1">
        <legend className="mb-1 text-[15px] font-semibold">Cautions on this step</legend>
        <p className="mb-1 text-sm text-muted">
          Ticked cautions show at the top of the step. Headroom suggests them from the parts and the
          words; tick what applies.
        </p>
        <div className="flex flex-col rounded-md border border-rule-strong bg-white">
          {choosableCautionIds.map((id) => {
            const why = suggestions.find((s) => s.id === id)?.reasons;
            return (
              <label
                key={id}
                className="flex min-h-12 cursor-pointer items-start gap-3 border-b border-rule px-3 py-2.5 last:border-b-0"
              >
                <input
                  type="checkbox"
                  value={id}
                  {...cautionField}
                  className="mt-0.5 size-6 shrink-0 accent-accent-600"
                />
                <span className="min-w-0">
                  <span className="block font-semibold">{cautionChoiceLabels[id]}</span>
                  <span className="block text-sm text-muted">{cautionTexts[id].text}</span>
                  {why && (
                    <span className="mt-0.5 block text-sm font-semibold text-ink-2">
                      Suggested: {why.join('; ')}
                    </span>
                  )}
                </span>
              </label>
            );
          })}
        </div>
        {errors.cautions?.message && (
          <p className="text-sm font-semibold text-over">{errors.cautions.message}</p>
        )}
      </fieldset>

      <FormActions
        large
        error={errors.root?.server?.message}
        onCancel={onCancel}
        submitLabel={submitLabel}
        pending={isSubmitting}
      />
    </form>
  );
}
