import { Link } from 'react-router-dom';
import { useForm, type Path } from 'react-hook-form';
import type { z } from 'zod';
import type { signInInputSchema } from '@shared/schemas/auth';
import { Button } from '@/components/ui/button';
import { FormField, TextInput } from '@/components/ui/form-field';
import { FormError } from '@/components/ui/form-error';
import { paths } from '@/config/paths';
import { applyServerErrors } from '@/lib/form-errors';
import { lazyResolver } from '@/lib/lazy-resolver';
import { useSignIn } from '../api/sign-in';

type Input = z.input<typeof signInInputSchema>;
type Output = z.output<typeof signInInputSchema>;
// zod and the schema load when the form is first used, not with the page.
const resolver = lazyResolver<Input, Output>(() =>
  Promise.all([import('@hookform/resolvers/zod'), import('@shared/schemas/auth')]).then(
    ([{ zodResolver }, schemas]) => zodResolver(schemas.signInInputSchema),
  ),
);
const fieldNames: Path<Input>[] = ['email', 'password'];

/** On success the session is cached and the sign-in page redirects to `next`. */
export function SignInForm({ next }: { next: string | null }) {
  const signIn = useSignIn();
  const {
    register,
    handleSubmit,
    setError,
    watch,
    formState: { errors, isSubmitting },
  } = useForm<Input, unknown, Output>({
    resolver,
    defaultValues: { email: '', password: '' },
  });

  const submit = handleSubmit(async (values) => {
    try {
      await signIn.mutateAsync(values);
    } catch (error) {
      applyServerErrors(error, setError, fieldNames);
    }
  });

  return (
    <form
      onSubmit={submit}
      onInputCapture={resolver.preload}
      noValidate
      className="flex flex-col gap-4"
    >
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
      <FormField label="Password" error={errors.password?.message}>
        {(c) => (
          <TextInput
            {...c}
            {...register('password')}
            type="password"
            autoComplete="current-password"
          />
        )}
      </FormField>
      <Link
        to={paths.auth.forgotPassword.getHref()}
        state={{ email: watch('email') }}
        className="-mt-3 inline-flex min-h-11 items-center self-start font-semibold text-accent-700 underline"
      >
        Forgot your password?
      </Link>
      <FormError message={errors.root?.server?.message} />
      <Button type="submit" pending={isSubmitting} className="w-full">
        Sign in
      </Button>
      <p className="text-center text-ink-2">
        New to Headroom?{' '}
        <Link
          to={paths.auth.signUp.getHref(next)}
          className="inline-flex min-h-11 items-center font-semibold text-accent-700 underline"
        >
          Create account
        </Link>
      </p>
    </form>
  );
}
