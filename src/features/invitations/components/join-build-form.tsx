import { useForm, type Path } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { z } from 'zod';
import { displayNameSchema, passwordSchema } from '@shared/schemas/auth';
import { Button } from '@/components/ui/button';
import { FormField, TextInput } from '@/components/ui/form-field';
import { FormError } from '@/components/ui/form-error';
import { isApiError } from '@/lib/api-client';
import { applyServerErrors } from '@/lib/form-errors';
import { useAcceptInvitation, type AcceptInvitationResult } from '../api/accept-invitation';

// Signed out, both are required (the shared accept schema makes them optional for the signed-in case).
const joinSchema = z.object({ displayName: displayNameSchema, password: passwordSchema });
type Input = z.input<typeof joinSchema>;
type Output = z.output<typeof joinSchema>;
const fieldNames: Path<Input>[] = ['displayName', 'password'];

/**
 * Signed out, and no account uses the invited address: a name and a password create it,
 * join the build and sign in, in one step. The link proves the address.
 */
export function JoinBuildForm({
  token,
  email,
  onJoined,
  onAccountExists,
}: {
  token: string;
  email: string;
  onJoined: (result: AcceptInvitationResult) => void;
  /** The address got an account since the page loaded: signing in is the way now. */
  onAccountExists: () => void;
}) {
  const accept = useAcceptInvitation();
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors, isSubmitting },
  } = useForm<Input, unknown, Output>({
    resolver: zodResolver(joinSchema),
    defaultValues: { displayName: '', password: '' },
  });

  const submit = handleSubmit(async (values) => {
    try {
      onJoined(await accept.mutateAsync({ token, input: values }));
    } catch (error) {
      if (isApiError(error) && error.code === 'email_taken') {
        onAccountExists();
        return;
      }
      applyServerErrors(error, setError, fieldNames);
    }
  });

  return (
    <form onSubmit={submit} noValidate aria-labelledby="join-title" className="flex flex-col gap-4">
      <div>
        <h2 id="join-title" className="text-lg font-bold">
          Create your account
        </h2>
        <p className="text-[15px] text-ink-2">
          It uses the address this invitation was sent to; choose a name and a password.
        </p>
      </div>
      {/* For password managers: the account the new password belongs to. */}
      <input type="email" name="username" autoComplete="username" value={email} readOnly hidden />
      <FormField
        label="Your name"
        error={errors.displayName?.message}
        hint="Shown to the people on your builds"
      >
        {(c) => <TextInput {...c} {...register('displayName')} autoComplete="name" />}
      </FormField>
      <FormField label="Password" error={errors.password?.message} hint="At least 10 characters">
        {(c) => (
          <TextInput {...c} {...register('password')} type="password" autoComplete="new-password" />
        )}
      </FormField>
      <FormError message={errors.root?.server?.message} />
      <Button type="submit" pending={isSubmitting} className="w-full">
        Join the build
      </Button>
    </form>
  );
}
