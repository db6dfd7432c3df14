import { useState } from 'react';
import { Link } from 'react-router-dom';
import { useForm, type Path } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import type { z } from 'zod';
import { requestPasswordResetInputSchema } from '@shared/schemas/password-reset';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { FormField, TextInput } from '@/components/ui/form-field';
import { FormError } from '@/components/ui/form-error';
import { paths } from '@/config/paths';
import { applyServerErrors } from '@/lib/form-errors';
import { useRequestPasswordReset } from '../api/request-password-reset';
import { textLinkClasses } from '@/components/ui/text-link';

type Input = z.input<typeof requestPasswordResetInputSchema>;
type Output = z.output<typeof requestPasswordResetInputSchema>;
const fieldNames: Path<Input>[] = ['email'];

/**
 * Asks for a reset link. The server answers the same whether or not the address has an
 * account, so the page shows that one message and nothing else.
 */
export function ForgotPasswordForm({ initialEmail = '' }: { initialEmail?: string }) {
  const requestReset = useRequestPasswordReset();
  const [answer, setAnswer] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    setFocus,
    formState: { errors, isSubmitting },
  } = useForm<Input, unknown, Output>({
    resolver: zodResolver(requestPasswordResetInputSchema),
    defaultValues: { email: initialEmail },
  });

  const submit = handleSubmit(async (values) => {
    try {
      setAnswer(await requestReset.mutateAsync(values));
    } catch (error) {
      applyServerErrors(error, setError, fieldNames);
    }
  });

  const backToSignIn = (
    <p className="text-center text-ink-2">
      Remembered it?{' '}
      <Link to={paths.auth.signIn.getHref()} className={textLinkClasses}>
        Back to sign in
      </Link>
    </p>
  );

  if (answer) {
    return (
      <div className="flex flex-col gap-4">
        <Alert tone="ok" title="Check your mail">
          {answer}
        </Alert>
        <p className="text-[15px] text-ink-2">
          Nothing after a few minutes? Look in the spam folder, or check the address and send it
          again.
        </p>
        <Button
          variant="secondary"
          className="w-full"
          onClick={() => {
            setAnswer(null);
            // The field is back on the next render; focus it once it is there.
            setTimeout(() => setFocus('email'), 0);
          }}
        >
          Check the address and resend
        </Button>
        {backToSignIn}
      </div>
    );
  }

  return (
    <form onSubmit={submit} noValidate className="flex flex-col gap-4">
      <FormField label="E-mail" error={errors.email?.message} hint="The address you sign in with">
        {(c) => (
          <TextInput
            {...c}
            {...register('email')}
            type="email"
            autoComplete="email"
            inputMode="email"
          />
        )}
      </FormField>
      <FormError message={errors.root?.server?.message} />
      <Button type="submit" pending={isSubmitting} className="w-full">
        E-mail me a link
      </Button>
      {backToSignIn}
    </form>
  );
}
