import { useState } from 'react';
import { useForm, type Path } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import type { z } from 'zod';
import { updateProfileInputSchema } from '@shared/schemas/account';
import type { User } from '@shared/schemas/auth';
import { FormActions } from '@/components/ui/form-actions';
import { FormField, TextInput } from '@/components/ui/form-field';
import { applyServerErrors } from '@/lib/form-errors';
import { useUpdateProfile } from '../api/update-profile';

type Input = z.input<typeof updateProfileInputSchema>;
type Output = z.output<typeof updateProfileInputSchema>;
const fieldNames: Path<Input>[] = ['displayName'];

/** My name, as every build I am on shows it. */
export function ProfileForm({ user }: { user: User }) {
  const update = useUpdateProfile();
  const [saved, setSaved] = useState(false);
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors, isSubmitting },
  } = useForm<Input, unknown, Output>({
    resolver: zodResolver(updateProfileInputSchema),
    defaultValues: { displayName: user.displayName },
  });
  const submit = handleSubmit(async (values) => {
    setSaved(false);
    try {
      await update.mutateAsync(values);
      setSaved(true);
    } catch (error) {
      applyServerErrors(error, setError, fieldNames);
    }
  });
  return (
    <form onSubmit={submit} noValidate aria-label="Your name" className="flex flex-col gap-3">
      <FormField
        label="Name"
        error={errors.displayName?.message}
        hint="How the crew, shops and viewers of your builds see you"
      >
        {(c) => <TextInput {...c} {...register('displayName')} autoComplete="name" />}
      </FormField>
      <FormActions
        layout="start"
        error={errors.root?.server?.message}
        notice={saved && 'Name saved.'}
        submitLabel="Save name"
        pending={isSubmitting}
      />
    </form>
  );
}
