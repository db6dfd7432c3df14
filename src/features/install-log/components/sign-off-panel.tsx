import { useState } from 'react';
import { BadgeCheck, LockOpen, ShieldAlert } from 'lucide-react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { z } from 'zod';
import type { SignOffBlocker } from '@shared/install-log/sign-off';
import { signOffInputSchema, type Step } from '@shared/schemas/install-log';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { ConfirmDialog } from '@/components/ui/confirm-dialog';
import { FormError } from '@/components/ui/form-error';
import { FormField, TextArea } from '@/components/ui/form-field';
import { isApiError } from '@/lib/api-client';
import { applyServerErrors } from '@/lib/form-errors';
import { useReopenStep } from '../api/reopen-step';
import { useSignOffStep } from '../api/sign-off-step';
import { formatWhen } from '@/lib/dates';
import { useOfflineQueue } from '@/lib/offline-queue';

// For the override the reason is required (the shared schema has it optional for a plain sign-off).
const overrideSchema = signOffInputSchema.required({ overrideReason: true });
type OverrideInput = z.input<typeof overrideSchema>;
type OverrideValues = z.output<typeof overrideSchema>;

function anchorFor(b: SignOffBlocker): string {
  if (b.kind === 'unticked') return `#check-${b.itemId}`;
  if (b.kind === 'out-of-spec') return `#fastener-${b.specId}-${b.position}`;
  return `#fastener-${b.specId}`;
}

/** What stands between the step and its sign-off; each line jumps to the thing to fix. */
function BlockerList({ blockers }: { blockers: SignOffBlocker[] }) {
  return (
    <ul className="mt-1 flex flex-col gap-1">
      {blockers.map((b, i) => (
        <li key={i}>
          <a
            href={anchorFor(b)}
            className="inline-flex min-h-10 items-center font-semibold underline decoration-1 underline-offset-2"
          >
            {b.message}
          </a>
        </li>
      ))}
    </ul>
  );
}

function OverrideForm({ step, onDone }: { step: Step; onDone: () => void }) {
  const signOff = useSignOffStep();
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors, isSubmitting },
  } = useForm<OverrideInput, unknown, OverrideValues>({
    resolver: zodResolver(overrideSchema),
    defaultValues: { overrideReason: '' },
  });
  const submit = handleSubmit(async (input) => {
    try {
      await signOff.mutateAsync({ buildId: step.buildId, stepId: step.id, input });
      onDone();
    } catch (error) {
      applyServerErrors(error, setError, ['overrideReason']);
    }
  });
  return (
    <form
      onSubmit={submit}
      noValidate
      className="mt-3 flex flex-col gap-3 rounded-md border border-rule-strong bg-white p-3"
    >
      <FormField
        label="Why sign off anyway?"
        error={errors.overrideReason?.message}
        hint="Kept with the sign-off, with the list above."
      >
        {(c) => <TextArea {...c} {...register('overrideReason')} rows={3} autoFocus />}
      </FormField>
      <FormError message={errors.root?.server?.message} />
      <div className="flex flex-col-reverse gap-2 sm:flex-row">
        <Button variant="secondary" className="min-h-12!" onClick={onDone}>
          Cancel
        </Button>
        <Button type="submit" variant="danger" className="min-h-12!" pending={isSubmitting}>
          Sign off over {step.signOffBlockers.length} open item
          {step.signOffBlockers.length === 1 ? '' : 's'}
        </Button>
      </div>
    </form>
  );
}

/** The end of a step: who signed it off, or what is left, with the owner's override. */
export function SignOffPanel({
  step,
  canSignOff,
  canOverride,
}: {
  step: Step;
  canSignOff: boolean;
  /** The owner: signs off over blockers with a reason, and reopens. */
  canOverride: boolean;
}) {
  const signOff = useSignOffStep();
  const reopen = useReopenStep();
  const [confirming, setConfirming] = useState(false);
  const [reopening, setReopening] = useState(false);
  const [overriding, setOverriding] = useState(false);
  // Readings and ticks kept on the phone are not on the server yet, so not in the blockers.
  const waitingHere = useOfflineQueue().items.filter(
    (i) => i.stepId === step.id && !i.problem,
  ).length;

  let body;
  if (step.signOff) {
    const { by, at, override } = step.signOff;
    body = (
      <div className="flex flex-col gap-3">
        <Alert tone="ok" title={`Signed off by ${by?.name ?? 'someone'}`}>
          {formatWhen(at)}. The step is locked; only the owner can reopen it.
        </Alert>
        {override && (
          <Alert tone="warning" title="Signed off over open items">
            <p>
              <span className="font-semibold">Reason:</span> “{override.reason}”
            </p>
            {override.blockers.length > 0 && (
              <ul className="mt-1 list-disc pl-5">
                {override.blockers.map((b, i) => (
                  <li key={i}>{b.message}</li>
                ))}
              </ul>
            )}
          </Alert>
        )}
        {canOverride && (
          <Button
            variant="secondary"
            className="min-h-12! self-start"
            icon={<LockOpen aria-hidden className="size-5" />}
            onClick={() => {
              reopen.reset();
              setReopening(true);
            }}
          >
            Reopen this step
          </Button>
        )}
      </div>
    );
  } else if (step.signOffBlockers.length === 0) {
    body = (
      <div className="flex flex-col gap-3">
        <p className="text-ink-2">
          {step.fasteners.length === 0 && step.checklist.length === 0
            ? 'No checks or torque specs on this step: nothing holds up its sign-off.'
            : 'Every position reads in spec and every check is ticked.'}
          {!canSignOff && ' The owner or crew signs it off.'}
        </p>
        {canSignOff && (
          <Button
            className="min-h-14! w-full text-lg sm:w-auto sm:self-start"
            icon={<BadgeCheck aria-hidden className="size-6" />}
            onClick={() => {
              signOff.reset();
              setConfirming(true);
            }}
          >
            Sign off this step
          </Button>
        )}
      </div>
    );
  } else {
    const n = step.signOffBlockers.length;
    body = (
      <div className="flex flex-col gap-2">
        <Alert tone="warning" title={`Not ready to sign off: ${n} open item${n === 1 ? '' : 's'}`}>
          <BlockerList blockers={step.signOffBlockers} />
        </Alert>
        {waitingHere > 0 && (
          <p className="text-[15px] text-ink-2" data-testid="sign-off-waiting">
            Entries waiting on this phone count here once they are sent.
          </p>
        )}
        {canSignOff && !canOverride && (
          <p className="text-[15px] text-ink-2">
            Sign-off opens when every position reads in spec and every check is ticked. Only the
            owner can sign off over open items.
          </p>
        )}
        {canOverride && !overriding && (
          <Button
            variant="secondary"
            className="min-h-12! self-start"
            icon={<ShieldAlert aria-hidden className="size-5" />}
            onClick={() => setOverriding(true)}
          >
            Sign off anyway…
          </Button>
        )}
        {canOverride && overriding && (
          <OverrideForm step={step} onDone={() => setOverriding(false)} />
        )}
      </div>
    );
  }

  const signOffError =
    signOff.isError &&
    (isApiError(signOff.error) && signOff.error.code === 'sign_off_blocked'
      ? 'Something changed since this page loaded; see what is still open above.'
      : signOff.error.message);

  return (
    <section aria-labelledby="sign-off-title" className="rounded-lg border border-rule bg-sheet">
      <h2
        id="sign-off-title"
        className="border-b border-rule px-4 py-2.5 text-lg font-bold sm:px-5"
      >
        Sign-off
      </h2>
      <div className="flex flex-col gap-3 px-4 py-4 sm:px-5">
        {body}
        {signOffError && !confirming && <Alert tone="error">{signOffError}</Alert>}
      </div>

      <ConfirmDialog
        open={confirming}
        title="Sign off this step?"
        tone="primary"
        confirmLabel="Sign off"
        pending={signOff.isPending}
        onClose={() => setConfirming(false)}
        onConfirm={() =>
          signOff.mutate(
            { buildId: step.buildId, stepId: step.id, input: {} },
            { onSettled: () => setConfirming(false) },
          )
        }
      >
        “{step.title}” is then locked: no more readings or ticks. Only the owner can reopen it.
      </ConfirmDialog>

      <ConfirmDialog
        open={reopening}
        title="Reopen this step?"
        tone="primary"
        confirmLabel="Reopen"
        pending={reopen.isPending}
        onClose={() => setReopening(false)}
        onConfirm={() =>
          reopen.mutate(
            { buildId: step.buildId, stepId: step.id },
            { onSuccess: () => setReopening(false) },
          )
        }
      >
        The sign-off is cleared and the step goes back to under way. Readings, ticks and photos
        stay.
        {reopen.isError && (
          <p role="alert" className="mt-2 font-semibold text-over">
            {reopen.error.message}
          </p>
        )}
      </ConfirmDialog>
    </section>
  );
}
