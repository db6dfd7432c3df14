import { useForm, type Path } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import type { z } from 'zod';
import { createJobInputSchema, type Job } from '@shared/schemas/install-log';
import { FormActions } from '@/components/ui/form-actions';
import { FormField, TextArea, TextInput } from '@/components/ui/form-field';
import { applyServerErrors } from '@/lib/form-errors';

type Input = z.input<typeof createJobInputSchema>;
type Values = z.output<typeof createJobInputSchema>;
const fieldNames: Path<Input>[] = ['title', 'notes'];

/**
 * A new job, or an existing one to rename (`job` given). An edit sends both fields, which
 * the server's partial update schema accepts as well.
 */
export function JobForm({
  job,
  submitLabel = 'Add job',
  onSubmit,
  onCancel,
}: {
  job?: Pick<Job, 'title' | 'notes'>;
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
    resolver: zodResolver(createJobInputSchema),
    defaultValues: { title: job?.title ?? '', notes: job?.notes ?? '' },
  });
  const submit = handleSubmit(async (values) => {
    try {
      await onSubmit(values);
    } catch (error) {
      applyServerErrors(error, setError, fieldNames);
    }
  });
  return (
    <form onSubmit={submit} noValidate className="flex flex-col gap-4">
      <FormField
        label="Job name"
        error={errors.title?.message}
        hint="What gets done, e.g. “Fit the injectors”"
      >
        {(c) => <TextInput {...c} {...register('title')} autoComplete="off" autoFocus />}
      </FormField>
      <FormField label="Notes" optional error={errors.notes?.message}>
        {(c) => <TextArea {...c} {...register('notes')} rows={3} />}
      </FormField>
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
