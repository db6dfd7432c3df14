import { useState } from 'react';
import { useForm, type Path } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import type { z } from 'zod';
import { changeEmailInputSchema } from '@shared/schemas/account';
import type { User } from '@shared/schemas/auth';
import { FormActions } from '@/components/ui/form-actions';
import { FormField, TextInput } from '@/components/ui/form-field';
import { applyServerErrors } from '@/lib/form-errors';
import { useChangeEmail } from '../api/change-email';

type Input = z.input<typeof changeEmailInputSchema>;
type Output = z.output<typeof changeEmailInputSchema>;
const fieldNames: Path<Input>[] = ['email', 'currentPassword'];

/** A new address, with my current password; it changes once I follow the link mailed there. */
export function EmailForm({ user }: { user: User }) {
  const change = useChangeEmail();
  const [sent, setSent] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    reset,
    formState: { errors, isSubmitting },
  } = useForm<Input, unknown, Output>({
    resolver: zodResolver(changeEmailInputSchema),
    defaultValues: { email: '', currentPassword: '' },
  });
  const submit = handleSubmit(async (values) => {
    setSent(null);
    try {
      const { message } = await change.mutateAsync(values);
      reset({ email: '', currentPassword: '' });
      setSent(message);
    } catch (error) {
      applyServerErrors(error, setError, fieldNames);
    }
  });
  return (
    <form
      onSubmit={submit}
      noValidate
      aria-label="Your e-mail address"
      className="flex flex-col gap-3"
    >
      <p className="text-ink-2">
        Now: <span className="font-semibold break-all text-ink">{user.email}</span>
      </p>
      <div className="grid grid-cols-1 gap-3 sm:grid-cols-2">
        <FormField label="New e-mail address" error={errors.email?.message}>
          {(c) => (
            <TextInput
              {...c}
              {...register('email')}
              type="email"
              inputMode="email"
              autoComplete="email"
            />
          )}
        </FormField>
        <FormField label="Current password" error={errors.currentPassword?.message}>
          {(c) => (
            <TextInput
              {...c}
              {...register('currentPassword')}
              type="password"
              autoComplete="current-password"
            />
          )}
        </FormField>
      </div>
      <p className="text-sm text-muted">
        We mail a link to the new address; your address changes when you follow it.
      </p>
      <FormActions
        layout="start"
        error={errors.root?.server?.message}
        notice={sent}
        submitLabel="Send the link"
        pending={isSubmitting}
      />
    </form>
  );
}
