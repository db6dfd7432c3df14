import { useForm, type Path } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import type { z } from 'zod';
import { createStepInputSchema, type Step } from '../../../../shared/schemas/install-log';
import { partCategoryLabels, type Part } from '../../../../shared/schemas/parts';
import { Button } from '../../../components/ui/button';
import { FormError } from '../../../components/ui/form-error';
import { FormField, TextArea, TextInput } from '../../../components/ui/form-field';
import { applyServerErrors } from '../../../lib/form-errors';

type Input = z.input<typeof createStepInputSchema>;
type Values = z.output<typeof createStepInputSchema>;
const fieldNames: Path<Input>[] = ['title', 'description', 'partIds', 'liftsVehicle'];

/**
 * A new step: its name, what to do, the parts it fits and whether the truck is off the ground.
 * With `step` given it edits that step's name, what to do and the off-the-ground mark; its
 * linked parts are left as they are (they are not sent).
 */
export function StepForm({
  step,
  parts,
  submitLabel = 'Add step',
  onSubmit,
  onCancel,
}: {
  step?: Pick<Step, 'title' | 'description' | 'liftsVehicle'>;
  /** The build's parts to link; undefined while they load (or when they cannot be read). */
  parts: Part[] | undefined;
  submitLabel?: string;
  onSubmit: (values: Values) => Promise<unknown>;
  onCancel: () => void;
}) {
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors, isSubmitting },
  } = useForm<Input, unknown, Values>({
    resolver: zodResolver(createStepInputSchema),
    defaultValues: step
      ? { title: step.title, description: step.description, liftsVehicle: step.liftsVehicle }
      : { title: '', description: '', partIds: [], liftsVehicle: false },
  });
  const submit = handleSubmit(async (values) => {
    try {
      if (step) {
        const { title, description, liftsVehicle } = values;
        await onSubmit({ title, description, liftsVehicle });
      } else {
        await onSubmit(values);
      }
    } catch (error) {
      applyServerErrors(error, setError, fieldNames);
    }
  });
  const usable = step ? [] : (parts ?? []).filter((p) => p.status !== 'returned');
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

      <label className="flex min-h-12 cursor-pointer items-start gap-3 rounded-md border border-rule-strong bg-white px-3 py-3">
        <input
          type="checkbox"
          {...register('liftsVehicle')}
          className="mt-0.5 size-6 shrink-0 accent-accent-600"
        />
        <span>
          <span className="font-semibold">The truck or its cab is off the ground</span>
          <span className="block text-sm text-muted">Shows the stands and blocking caution.</span>
        </span>
      </label>

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

      <FormError message={errors.root?.server?.message} />
      <div className="flex flex-col-reverse gap-2 sm:flex-row sm:justify-end">
        <Button variant="secondary" className="min-h-12!" onClick={onCancel}>
          Cancel
        </Button>
        <Button type="submit" className="min-h-12!" pending={isSubmitting}>
          {submitLabel}
        </Button>
      </div>
    </form>
  );
}
