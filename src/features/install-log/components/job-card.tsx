import { Link } from 'react-router-dom';
import { ChevronRight, Pencil, Plus, Trash2 } from 'lucide-react';
import type { Job, Person, StepSummary } from '../../../../shared/schemas/install-log';
import { paths } from '../../../config/paths';
import { Button } from '../../../components/ui/button';
import { formatWhen } from '../../../lib/dates';
import { StepProgressChips } from './step-progress';
import { StepStatusBadge } from './step-status';

function StepRow({
  buildId,
  step,
  signedOffBy,
}: {
  buildId: string;
  step: StepSummary;
  signedOffBy?: Person | null;
}) {
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
            <StepStatusBadge status={step.status} />
            <StepProgressChips progress={step.progress} />
          </span>
          {step.signedOffAt && (
            <span className="text-sm text-muted">
              Signed off{signedOffBy ? ` by ${signedOffBy.name}` : ''},{' '}
              {formatWhen(step.signedOffAt)}
            </span>
          )}
        </span>
        <ChevronRight aria-hidden className="size-5 shrink-0 text-muted" />
      </Link>
    </li>
  );
}

/**
 * One job with its steps in order, each step a link to its page. The actions show only
 * when given (the page passes those the member's role allows).
 */
export function JobCard({
  buildId,
  job,
  signedOffBy,
  onAddStep,
  onEdit,
  onDelete,
}: {
  buildId: string;
  job: Job;
  /** Who signed off each signed-off step, when known. */
  signedOffBy: Map<string, Person | null>;
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
              : `${done} of ${job.steps.length} step${job.steps.length === 1 ? '' : 's'} signed off`}
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
            <StepRow key={s.id} buildId={buildId} step={s} signedOffBy={signedOffBy.get(s.id)} />
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
