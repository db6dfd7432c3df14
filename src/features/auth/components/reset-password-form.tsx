import { useForm, type Path } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import type { z } from 'zod';
import { completePasswordResetInputSchema } from '@shared/schemas/password-reset';
import { Button } from '@/components/ui/button';
import { FormField, TextInput } from '@/components/ui/form-field';
import { FormError } from '@/components/ui/form-error';
import { applyServerErrors } from '@/lib/form-errors';
import { useCompletePasswordReset } from '../api/complete-password-reset';

type Input = z.input<typeof completePasswordResetInputSchema>;
type Output = z.output<typeof completePasswordResetInputSchema>;
const fieldNames: Path<Input>[] = ['password'];

/** The new password, under the same rule as sign-up; on success the browser is signed in. */
export function ResetPasswordForm({
  token,
  email,
  onDone,
}: {
  token: string;
  email: string;
  onDone: () => void;
}) {
  const completeReset = useCompletePasswordReset();
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors, isSubmitting },
  } = useForm<Input, unknown, Output>({
    resolver: zodResolver(completePasswordResetInputSchema),
    defaultValues: { password: '' },
  });

  const submit = handleSubmit(async (values) => {
    try {
      await completeReset.mutateAsync({ token, input: values });
      onDone();
    } catch (error) {
      applyServerErrors(error, setError, fieldNames);
    }
  });

  return (
    <form onSubmit={submit} noValidate className="flex flex-col gap-4">
      {/* For password managers: which account the new password belongs to. */}
      <input type="email" name="username" autoComplete="username" value={email} readOnly hidden />
      <FormField
        label="New password"
        error={errors.password?.message}
        hint="At least 10 characters. Every other device signed in to this account is signed out."
      >
        {(c) => (
          <TextInput
            {...c}
            {...register('password')}
            type="password"
            autoComplete="new-password"
            autoFocus
          />
        )}
      </FormField>
      <FormError message={errors.root?.server?.message} />
      <Button type="submit" pending={isSubmitting} className="w-full">
        Set new password
      </Button>
    </form>
  );
}
