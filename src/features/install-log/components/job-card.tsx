import { Link } from 'react-router-dom';
import { ChevronRight, Pencil, Plus, Trash2 } from 'lucide-react';
import type { Job, StepSummary } from '@shared/schemas/install-log';
import { paths } from '@/config/paths';
import { Button } from '@/components/ui/button';
import { formatWhen } from '@/lib/dates';
import { StepProgressChips } from './step-progress';
import { StepStatusBadge } from './step-status';

/** Why the owner signed a step off over open items: one tap away from the list. */
function OverrideReason({ step }: { step: StepSummary }) {
  const override = step.signOff?.override;
  if (!override) return null;
  return (
    <details className="group mx-4 mb-3 rounded-md border border-tight/40 bg-tight-soft px-3 text-[15px] text-[#6b4408] sm:mx-5 sm:ml-17">
      <summary className="flex min-h-11 cursor-pointer items-center font-semibold">
        Why it was signed off anyway
        <span className="sr-only">: {step.title}</span>
      </summary>
      <p className="pb-1">“{override.reason}”</p>
      {override.blockers.length > 0 && (
        <ul className="list-disc pb-2 pl-5">
          {override.blockers.map((b, i) => (
            <li key={i}>{b.message}</li>
          ))}
        </ul>
      )}
    </details>
  );
}

function StepRow({ buildId, step }: { buildId: string; step: StepSummary }) {
  const signOff = step.signOff;
  return (
    <li>
      <Link
        to={paths.builds.step.getHref(buildId, step.id)}
        className="flex min-h-16 items-center gap-3 px-4 py-3 hover:bg-ink/[0.03] focus-visible:bg-ink/[0.03] sm:px-5"
      >
        <span
          aria-hidden
          className="flex size-9 shrink-0 items-center justify-center rounded-full bg-ink/[0.06] font-bold text-ink-2 tabular-nums"
        >
          {step.position}
        </span>
        <span className="flex min-w-0 flex-1 flex-col gap-1.5">
          <span className="text-[17px] leading-snug font-semibold text-ink">
            <span className="sr-only">Step {step.position}: </span>
            {step.title}
          </span>
          <span className="flex flex-wrap items-center gap-1.5">
            <StepStatusBadge status={step.status} overridden={!!signOff?.override} />
            <StepProgressChips progress={step.progress} />
          </span>
          {signOff && (
            <span className="text-sm text-muted">
              {signOff.override ? 'Signed off over open items' : 'Signed off'}
              {signOff.by ? ` by ${signOff.by.name}` : ''}, {formatWhen(signOff.at)}
            </span>
          )}
        </span>
        <ChevronRight aria-hidden className="size-5 shrink-0 text-muted" />
      </Link>
      <OverrideReason step={step} />
    </li>
  );
}

/**
 * One job with its steps in order, each step a link to its page. The actions show only
 * when given (the page passes those the member's role allows). A shop sees only the steps
 * that use its parts, numbered among those (`partial`), and is told so.
 */
export function JobCard({
  buildId,
  job,
  partial = false,
  onAddStep,
  onEdit,
  onDelete,
}: {
  buildId: string;
  job: Job;
  /** The caller sees only some of the job's steps (a shop: those using its parts). */
  partial?: boolean;
  onAddStep?: () => void;
  onEdit?: () => void;
  onDelete?: () => void;
}) {
  const done = job.steps.filter((s) => s.status === 'signed-off').length;
  const headingId = `job-${job.id}`;
  return (
    <section aria-labelledby={headingId} className="rounded-lg border border-rule bg-sheet">
      <div className="flex flex-wrap items-start justify-between gap-3 border-b border-rule px-4 py-3 sm:px-5">
        <div className="min-w-0">
          <h2 id={headingId} className="text-xl leading-tight font-bold text-ink">
            {job.title}
          </h2>
          <p className="mt-0.5 text-[15px] text-muted">
            {job.steps.length === 0
              ? 'No steps yet'
              : `${done} of ${job.steps.length} step${job.steps.length === 1 ? '' : 's'}${partial ? ' using your parts' : ''} signed off`}
          </p>
          {job.notes && (
            <p className="mt-1.5 text-[15px] whitespace-pre-line text-ink-2">{job.notes}</p>
          )}
        </div>
        {(onAddStep || onEdit || onDelete) && (
          <div className="flex flex-wrap items-center gap-2">
            {onAddStep && (
              <Button
                variant="secondary"
                size="sm"
                className="min-h-12!"
                icon={<Plus aria-hidden className="size-5" />}
                onClick={onAddStep}
              >
                Add step
                <span className="sr-only"> to {job.title}</span>
              </Button>
            )}
            {onEdit && (
              <Button
                variant="ghost"
                size="sm"
                className="min-h-12!"
                icon={<Pencil aria-hidden className="size-4" />}
                onClick={onEdit}
              >
                Edit
                <span className="sr-only"> the job “{job.title}”</span>
              </Button>
            )}
            {onDelete && (
              <button
                type="button"
                onClick={onDelete}
                aria-label={`Delete the job “${job.title}”`}
                className="inline-flex size-12 shrink-0 items-center justify-center rounded-md text-muted hover:bg-over-soft hover:text-over"
              >
                <Trash2 aria-hidden className="size-5" />
              </button>
            )}
          </div>
        )}
      </div>
      {job.steps.length > 0 ? (
        <ol className="divide-y divide-rule">
          {job.steps.map((s) => (
            <StepRow key={s.id} buildId={buildId} step={s} />
          ))}
        </ol>
      ) : (
        <p className="px-4 py-4 text-muted sm:px-5">
          Break the job into steps: each gets its checklist, torque specs and photos.
        </p>
      )}
    </section>
  );
}
