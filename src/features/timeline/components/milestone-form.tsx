import { useForm, type Path } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import type { z } from 'zod';
import { createMilestoneInputSchema, type Milestone } from '@shared/schemas/timeline';
import { FormActions } from '@/components/ui/form-actions';
import { FormField, TextInput } from '@/components/ui/form-field';
import { applyServerErrors } from '@/lib/form-errors';

type Input = z.input<typeof createMilestoneInputSchema>;
type Values = z.output<typeof createMilestoneInputSchema>;
const fieldNames: Path<Input>[] = ['title', 'dueOn'];

/** A milestone's title and date: a new one (the form empties after saving) or one to change. */
export function MilestoneForm({
  milestone,
  submitLabel,
  onSubmit,
  onCancel,
}: {
  milestone?: Pick<Milestone, 'title' | 'dueOn'>;
  submitLabel: string;
  onSubmit: (values: Values) => Promise<unknown>;
  onCancel?: () => void;
}) {
  const {
    register,
    handleSubmit,
    setError,
    reset,
    formState: { errors, isSubmitting },
  } = useForm<Input, unknown, Values>({
    resolver: zodResolver(createMilestoneInputSchema),
    defaultValues: { title: milestone?.title ?? '', dueOn: milestone?.dueOn ?? '' },
  });
  const submit = handleSubmit(async (values) => {
    try {
      await onSubmit(values);
      if (!milestone) reset({ title: '', dueOn: '' });
    } catch (error) {
      applyServerErrors(error, setError, fieldNames);
    }
  });
  return (
    <form
      onSubmit={submit}
      noValidate
      aria-label={milestone ? 'Change the milestone' : 'Add a milestone'}
      className="flex flex-col gap-3"
    >
      <div className={milestone ? 'grid gap-3 sm:grid-cols-[minmax(0,1fr)_11rem]' : 'grid gap-3'}>
        <FormField label="Milestone" error={errors.title?.message}>
          {(c) => (
            <TextInput
              {...c}
              {...register('title')}
              autoComplete="off"
              placeholder="e.g. Engine back together"
            />
          )}
        </FormField>
        <FormField label="Date" error={errors.dueOn?.message}>
          {(c) => <TextInput {...c} {...register('dueOn')} type="date" />}
        </FormField>
      </div>
      <FormActions
        error={errors.root?.server?.message}
        onCancel={onCancel}
        submitLabel={submitLabel}
        submitVariant={milestone ? 'primary' : 'secondary'}
        pending={isSubmitting}
      />
    </form>
  );
}
