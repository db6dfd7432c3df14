import { useState } from 'react';
import { useForm, type Path } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import type { z } from 'zod';
import { changePasswordInputSchema } from '@shared/schemas/account';
import type { User } from '@shared/schemas/auth';
import { FormActions } from '@/components/ui/form-actions';
import { FormField, TextInput } from '@/components/ui/form-field';
import { applyServerErrors } from '@/lib/form-errors';
import { useChangePassword } from '../api/change-password';

type Input = z.input<typeof changePasswordInputSchema>;
type Output = z.output<typeof changePasswordInputSchema>;
const fieldNames: Path<Input>[] = ['currentPassword', 'newPassword'];

/** A new password, with the current one; every other device signed in is signed out. */
export function PasswordForm({ user }: { user: User }) {
  const change = useChangePassword();
  const [done, setDone] = useState(false);
  const {
    register,
    handleSubmit,
    setError,
    reset,
    formState: { errors, isSubmitting },
  } = useForm<Input, unknown, Output>({
    resolver: zodResolver(changePasswordInputSchema),
    defaultValues: { currentPassword: '', newPassword: '' },
  });
  const submit = handleSubmit(async (values) => {
    setDone(false);
    try {
      await change.mutateAsync(values);
      reset({ currentPassword: '', newPassword: '' });
      setDone(true);
    } catch (error) {
      applyServerErrors(error, setError, fieldNames);
    }
  });
  return (
    <form onSubmit={submit} noValidate aria-label="Your password" className="flex flex-col gap-3">
      {/* For password managers: which account the new password belongs to. */}
      <input
        type="email"
        name="username"
        autoComplete="username"
        value={user.email}
        readOnly
        hidden
      />
      <div className="grid grid-cols-1 gap-3 sm:grid-cols-2">
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
        <FormField
          label="New password"
          error={errors.newPassword?.message}
          hint="At least 10 characters"
        >
          {(c) => (
            <TextInput
              {...c}
              {...register('newPassword')}
              type="password"
              autoComplete="new-password"
            />
          )}
        </FormField>
      </div>
      <p className="text-sm text-muted">
        Every other phone and computer signed in to your account is signed out; this one stays.
      </p>
      <FormActions
        layout="start"
        error={errors.root?.server?.message}
        notice={done && 'Password changed. Every other device has been signed out.'}
        submitLabel="Change password"
        pending={isSubmitting}
      />
    </form>
  );
}
