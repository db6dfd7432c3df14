import { useState } from 'react';
import { Link } from 'react-router-dom';
import { Flame } from 'lucide-react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import type { z } from 'zod';
import { closeRetorqueInputSchema, type RetorqueCheck } from '@shared/schemas/install-log';
import { positionList } from '@shared/install-log/positions';
import { paths } from '@/config/paths';
import { FormActions } from '@/components/ui/form-actions';
import { Button } from '@/components/ui/button';
import { FormField, TextArea } from '@/components/ui/form-field';
import { applyServerErrors } from '@/lib/form-errors';
import { useCloseRetorqueCheck } from '../api/close-retorque-check';
import { formatWhen } from '@/lib/dates';

type Input = z.input<typeof closeRetorqueInputSchema>;
type Values = z.output<typeof closeRetorqueInputSchema>;

/** "Re-check after 3 heat cycles: Down-pipe flange nuts" */
function retorqueHeadline(check: Pick<RetorqueCheck, 'description' | 'specName'>) {
  return `Re-check ${check.description}: ${check.specName}`;
}

function CloseForm({
  buildId,
  check,
  onDone,
}: {
  buildId: string;
  check: RetorqueCheck;
  onDone: () => void;
}) {
  const close = useCloseRetorqueCheck();
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors, isSubmitting },
  } = useForm<Input, unknown, Values>({
    resolver: zodResolver(closeRetorqueInputSchema),
    defaultValues: { note: '' },
  });
  const submit = handleSubmit(async (input) => {
    try {
      await close.mutateAsync({ buildId, specId: check.specId, input });
      onDone();
    } catch (error) {
      applyServerErrors(error, setError, ['note']);
    }
  });
  return (
    <form onSubmit={submit} noValidate className="mt-3 flex flex-col gap-3">
      <FormField
        label="How was it re-checked?"
        error={errors.note?.message}
        hint="e.g. “Re-torqued at the shop, sheet in the photos”"
      >
        {(c) => <TextArea {...c} {...register('note')} rows={2} autoFocus />}
      </FormField>
      <FormActions
        large
        error={errors.root?.server?.message}
        onCancel={onDone}
        submitLabel="Close the re-check"
        pending={isSubmitting}
      />
    </form>
  );
}

function CheckItem({
  buildId,
  check,
  canWrite,
}: {
  buildId: string;
  check: RetorqueCheck;
  canWrite: boolean;
}) {
  const [closing, setClosing] = useState(false);
  const left = check.positionsLeft;
  return (
    <li className="px-4 py-3 sm:px-5">
      <p className="text-[17px] leading-snug font-bold text-ink">{retorqueHeadline(check)}</p>
      <p className="mt-0.5 text-[15px] text-ink-2">
        {check.count === 1
          ? 'Not re-checked yet'
          : left.length === check.count
            ? `All ${check.count} still to re-check`
            : `Still to re-check: ${positionList(check.positionNames, left)}`}
        {check.since && <> · signed off {formatWhen(check.since)}</>}
      </p>
      <p className="text-sm text-muted">
        {check.jobTitle} › {check.stepTitle}
      </p>
      {!closing && (
        <div className="mt-2 flex flex-wrap gap-2">
          <Link
            to={`${paths.builds.step.getHref(buildId, check.stepId)}#fastener-${check.specId}`}
            className="inline-flex min-h-12 items-center rounded-md border border-rule-strong bg-sheet px-4 font-semibold text-ink shadow-sm hover:border-ink-3"
          >
            Record the re-check
          </Link>
          {canWrite && (
            <Button variant="ghost" className="min-h-12!" onClick={() => setClosing(true)}>
              Close with a note
            </Button>
          )}
        </div>
      )}
      {closing && <CloseForm buildId={buildId} check={check} onDone={() => setClosing(false)} />}
    </li>
  );
}

/** Open re-torque checks, listed plainly at the top of the install log. */
export function RetorqueChecks({
  buildId,
  checks,
  canWrite,
}: {
  buildId: string;
  checks: RetorqueCheck[];
  canWrite: boolean;
}) {
  if (checks.length === 0) return null;
  return (
    <section
      aria-labelledby="retorque-title"
      className="rounded-lg border-2 border-tight/60 bg-tight-soft/60"
    >
      <h2
        id="retorque-title"
        className="flex items-center gap-2 border-b border-tight/30 px-4 py-2.5 text-lg font-bold text-[#6b4408] sm:px-5"
      >
        <Flame aria-hidden className="size-5" />
        Re-torque checks due ({checks.length})
      </h2>
      <ul className="divide-y divide-tight/20">
        {checks.map((c) => (
          <CheckItem key={c.specId} buildId={buildId} check={c} canWrite={canWrite} />
        ))}
      </ul>
    </section>
  );
}
