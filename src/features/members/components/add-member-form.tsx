import { useState } from 'react';
import { useForm, type Path } from 'react-hook-form';
import type { z } from 'zod';
import { UserPlus } from 'lucide-react';
import type { addMemberInputSchema } from '../../../../shared/schemas/builds';
import { roleDescriptions, roleLabels, roles, type Role } from '../../../../shared/permissions';
import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { FormField, SelectInput, TextInput } from '../../../components/ui/form-field';
import { FormError } from '../../../components/ui/form-error';
import { isApiError } from '../../../lib/api-client';
import { applyServerErrors } from '../../../lib/form-errors';
import { lazyResolver } from '../../../lib/lazy-resolver';
import { useAddMember } from '../api/add-member';

type Input = z.input<typeof addMemberInputSchema>;
type Output = z.output<typeof addMemberInputSchema>;
// zod and the schema load when the form is first used, not with the page.
const resolver = lazyResolver<Input, Output>(() =>
  Promise.all([
    import('@hookform/resolvers/zod'),
    import('../../../../shared/schemas/builds'),
  ]).then(([{ zodResolver }, schemas]) => zodResolver(schemas.addMemberInputSchema)),
);
const fieldNames: Path<Input>[] = ['email', 'role'];

/** Owners add someone who already has a Headroom account, by e-mail, with a role. */
export function AddMemberForm({ buildId }: { buildId: string }) {
  const addMember = useAddMember();
  const [added, setAdded] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    watch,
    reset,
    setError,
    formState: { errors, isSubmitting },
  } = useForm<Input, unknown, Output>({
    resolver,
    defaultValues: { email: '', role: 'crew' },
  });
  const role = (watch('role') ?? 'crew') as Role;

  const submit = handleSubmit(async (values) => {
    setAdded(null);
    try {
      const member = await addMember.mutateAsync({ buildId, input: values });
      reset({ email: '', role: values.role });
      // The name is not repeated here: it already appears once, in the list above.
      setAdded(
        `Added as ${roleLabels[member.role].toLowerCase()}. The build is now in their list.`,
      );
    } catch (error) {
      // "Already on this build" is about the address typed, so it goes next to it.
      if (isApiError(error) && error.code === 'already_member' && !error.fields?.email) {
        setError('email', { type: 'server', message: error.message }, { shouldFocus: true });
        return;
      }
      applyServerErrors(error, setError, fieldNames);
    }
  });

  return (
    <form
      onInputCapture={resolver.preload}
      onSubmit={submit}
      noValidate
      aria-labelledby="add-member-title"
      className="flex flex-col gap-3 rounded-md border border-rule bg-paper/60 p-4"
    >
      <h3 id="add-member-title" className="flex items-center gap-2 font-bold">
        <UserPlus aria-hidden className="size-5 text-ink-3" />
        Add someone
      </h3>
      <p className="-mt-2 text-sm text-muted">They need a Headroom account with this e-mail.</p>
      <div className="grid grid-cols-1 gap-3 sm:grid-cols-[1fr_12rem]">
        <FormField label="E-mail" error={errors.email?.message}>
          {(c) => (
            <TextInput
              {...c}
              {...register('email')}
              type="email"
              autoComplete="off"
              inputMode="email"
              placeholder="name@example.com"
            />
          )}
        </FormField>
        <FormField label="Role" error={errors.role?.message}>
          {(c) => (
            <SelectInput {...c} {...register('role')}>
              {roles.map((value) => (
                <option key={value} value={value}>
                  {roleLabels[value]}
                </option>
              ))}
            </SelectInput>
          )}
        </FormField>
      </div>
      <p className="text-sm text-ink-2">
        <span className="font-semibold">{roleLabels[role]}:</span> {roleDescriptions[role]}
      </p>
      <FormError message={errors.root?.server?.message} />
      {added && <Alert tone="ok">{added}</Alert>}
      <div>
        <Button
          type="submit"
          pending={isSubmitting}
          icon={<UserPlus aria-hidden className="size-4" />}
        >
          Add member
        </Button>
      </div>
    </form>
  );
}
