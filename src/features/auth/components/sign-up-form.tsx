import { Link } from 'react-router-dom';
import { useForm, type Path } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import type { z } from 'zod';
import { signUpInputSchema } from '@shared/schemas/auth';
import { Button } from '@/components/ui/button';
import { FormField, TextInput } from '@/components/ui/form-field';
import { FormError } from '@/components/ui/form-error';
import { paths } from '@/config/paths';
import { applyServerErrors } from '@/lib/form-errors';
import { useSignUp } from '../api/sign-up';

type Input = z.input<typeof signUpInputSchema>;
type Output = z.output<typeof signUpInputSchema>;
const fieldNames: Path<Input>[] = ['displayName', 'email', 'password'];

export function SignUpForm({ next }: { next: string | null }) {
  const signUp = useSignUp();
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors, isSubmitting },
  } = useForm<Input, unknown, Output>({
    resolver: zodResolver(signUpInputSchema),
    defaultValues: { displayName: '', email: '', password: '' },
  });

  const submit = handleSubmit(async (values) => {
    try {
      await signUp.mutateAsync(values);
    } catch (error) {
      applyServerErrors(error, setError, fieldNames);
    }
  });

  return (
    <form onSubmit={submit} noValidate className="flex flex-col gap-4">
      <FormField
        label="Your name"
        error={errors.displayName?.message}
        hint="Shown to the people on your builds"
      >
        {(c) => <TextInput {...c} {...register('displayName')} autoComplete="name" />}
      </FormField>
      <FormField label="E-mail" error={errors.email?.message}>
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
      <FormField label="Password" error={errors.password?.message} hint="At least 10 characters">
        {(c) => (
          <TextInput {...c} {...register('password')} type="password" autoComplete="new-password" />
        )}
      </FormField>
      <FormError message={errors.root?.server?.message} />
      <Button type="submit" pending={isSubmitting} className="w-full">
        Create account
      </Button>
      <p className="text-center text-ink-2">
        Already have an account?{' '}
        <Link
          to={paths.auth.signIn.getHref(next)}
          className="inline-flex min-h-11 items-center font-semibold text-accent-700 underline"
        >
          Sign in
        </Link>
      </p>
    </form>
  );
}
