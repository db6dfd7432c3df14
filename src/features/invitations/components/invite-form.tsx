import { useState } from 'react';
import { useForm, type Path } from 'react-hook-form';
import type { z } from 'zod';
import { Send } from 'lucide-react';
import { roleDescriptions, roleLabels, roles, type Role } from '@shared/permissions';
import { invitationValidDays } from '@shared/invitations/rules';
import type { createInvitationInputSchema } from '@shared/schemas/invitations';
import { FormActions } from '@/components/ui/form-actions';
import { FormField, SelectInput, TextInput } from '@/components/ui/form-field';
import { applyServerErrors } from '@/lib/form-errors';
import { lazyResolver } from '@/lib/lazy-resolver';
import { useCreateInvitation } from '../api/create-invitation';

type Input = z.input<typeof createInvitationInputSchema>;
type Output = z.output<typeof createInvitationInputSchema>;
// zod and the schema load when the form is first used, not with the page.
const resolver = lazyResolver<Input, Output>(() =>
  Promise.all([import('@hookform/resolvers/zod'), import('@shared/schemas/invitations')]).then(
    ([{ zodResolver }, schemas]) => zodResolver(schemas.createInvitationInputSchema),
  ),
);
const fieldNames: Path<Input>[] = ['email', 'role'];

/** The owner's one way to bring someone in: an e-mail with a link; no account needed. */
export function InviteForm({ buildId }: { buildId: string }) {
  const createInvitation = useCreateInvitation();
  const [sent, setSent] = useState<string | null>(null);
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
    setSent(null);
    try {
      const invitation = await createInvitation.mutateAsync({ buildId, input: values });
      reset({ email: '', role: values.role });
      setSent(
        `Invitation sent to ${invitation.email}. The link works for ${invitationValidDays} days.`,
      );
    } catch (error) {
      applyServerErrors(error, setError, fieldNames);
    }
  });

  return (
    <form
      onInputCapture={resolver.preload}
      onSubmit={submit}
      noValidate
      aria-label="Send an invitation"
      className="flex flex-col gap-3"
    >
      <div className="grid grid-cols-1 gap-3 sm:grid-cols-[1fr_11rem]">
        <FormField label="Address to invite" error={errors.email?.message}>
          {(c) => (
            <TextInput
              {...c}
              {...register('email')}
              type="email"
              // Opened in a dialog for this one thing: the address is what comes first.
              autoFocus
              autoComplete="off"
              inputMode="email"
              placeholder="name@example.com"
            />
          )}
        </FormField>
        <FormField label="Invite as" error={errors.role?.message}>
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
      <FormActions
        layout="start"
        error={errors.root?.server?.message}
        notice={sent}
        submitLabel="Send invitation"
        submitIcon={<Send aria-hidden className="size-4" />}
        pending={isSubmitting}
      />
    </form>
  );
}
