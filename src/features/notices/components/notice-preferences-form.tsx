import { useId, useState } from 'react';
import { useForm, type UseFormRegister } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import type { z } from 'zod';
import {
  noticeKindDescriptions,
  noticeKindLabels,
  noticeKinds,
  noticePreferencesInputSchema,
  type NoticeKind,
  type NoticePreferences,
} from '@shared/schemas/notices';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { FormError } from '@/components/ui/form-error';
import { applyServerErrors } from '@/lib/form-errors';
import { useUpdateNoticePreferences } from '../api/update-notice-preferences';

type Input = z.input<typeof noticePreferencesInputSchema>;
type Output = z.output<typeof noticePreferencesInputSchema>;

function NoticeSwitch({ kind, register }: { kind: NoticeKind; register: UseFormRegister<Input> }) {
  const id = useId();
  return (
    <li className="flex items-center justify-between gap-4 py-3 first:pt-0 last:pb-0">
      <div className="min-w-0">
        <label htmlFor={id} className="cursor-pointer font-semibold text-ink">
          {noticeKindLabels[kind]}
        </label>
        <p id={`${id}-description`} className="text-sm text-muted">
          {noticeKindDescriptions[kind]}
        </p>
      </div>
      {/* A checkbox drawn as a switch; the invisible input covers a 44 px touch target. */}
      <span className="relative flex min-h-11 w-14 shrink-0 items-center justify-end">
        <input
          id={id}
          type="checkbox"
          role="switch"
          aria-describedby={`${id}-description`}
          className="peer absolute inset-0 m-0 size-full cursor-pointer opacity-0"
          {...register(kind)}
        />
        <span
          aria-hidden
          className="h-7 w-12 rounded-full bg-rule-strong transition-colors peer-checked:bg-accent-600 peer-focus-visible:outline-3 peer-focus-visible:outline-offset-2 peer-focus-visible:outline-accent-500"
        />
        <span
          aria-hidden
          className="pointer-events-none absolute top-1/2 right-[1.375rem] size-6 -translate-y-1/2 rounded-full bg-white shadow transition-transform peer-checked:translate-x-5"
        />
      </span>
    </li>
  );
}

/** My notices on one build: a switch per kind, saved together. */
export function NoticePreferencesForm({
  buildId,
  preferences,
}: {
  buildId: string;
  preferences: NoticePreferences;
}) {
  const update = useUpdateNoticePreferences();
  const [saved, setSaved] = useState(false);
  const {
    register,
    handleSubmit,
    reset,
    setError,
    watch,
    formState: { errors, isSubmitting, isDirty },
  } = useForm<Input, unknown, Output>({
    resolver: zodResolver(noticePreferencesInputSchema),
    defaultValues: preferences,
  });
  const values = watch();
  const onCount = noticeKinds.filter((k) => values[k] !== false).length;

  const submit = handleSubmit(async (input) => {
    setSaved(false);
    try {
      const stored = await update.mutateAsync({ buildId, input });
      reset(stored);
      setSaved(true);
    } catch (error) {
      applyServerErrors(error, setError, []);
    }
  });

  return (
    <form
      onSubmit={submit}
      onChange={() => setSaved(false)}
      noValidate
      aria-label="Notices"
      className="flex flex-col gap-4"
    >
      <ul className="divide-y divide-rule">
        {noticeKinds.map((kind) => (
          <NoticeSwitch key={kind} kind={kind} register={register} />
        ))}
      </ul>
      <FormError message={errors.root?.server?.message} />
      {saved && !isDirty && (
        <Alert tone="ok">
          Saved.{' '}
          {onCount === 0
            ? 'You get no notices from this build.'
            : `You get ${onCount} of ${noticeKinds.length} kinds of notice.`}
        </Alert>
      )}
      <div className="flex flex-wrap items-center gap-3">
        <Button type="submit" pending={isSubmitting}>
          Save notices
        </Button>
        {isDirty && <span className="text-sm text-muted">Unsaved changes</span>}
      </div>
    </form>
  );
}
