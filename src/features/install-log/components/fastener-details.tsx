import type { ReactNode } from 'react';
import { BookOpen } from 'lucide-react';
import { convertTorque } from '@shared/install-log/torque';
import { threadConditionLabels, type FastenerSpec } from '@shared/schemas/install-log';
import { formatWhen } from '@/lib/dates';
import {
  altBandText,
  altTargetText,
  bandText,
  convertedTorque,
  exact,
  targetText,
  torque,
} from '../lib/format';

function Detail({ term, children }: { term: string; children: ReactNode }) {
  return (
    <div className="grid grid-cols-[6.5rem_minmax(0,1fr)] gap-2 py-1.5 sm:grid-cols-[8rem_minmax(0,1fr)]">
      <dt className="font-semibold text-ink-2">{term}</dt>
      <dd className="min-w-0 text-ink">{children}</dd>
    </div>
  );
}

/** "Stage 1: 15 lbf·ft (20.3 N·m)", … "Final: 30 lbf·ft", "Then turn: 90°" */
function StagesText({ spec }: { spec: FastenerSpec }) {
  const steps = [...spec.stages, spec.targetValue];
  return (
    <ol className="flex flex-col gap-0.5">
      {steps.map((v, i) => (
        <li key={i} className="tabular-nums">
          <span className="font-semibold">
            {i === steps.length - 1 ? 'Final' : `Stage ${i + 1}`}:
          </span>{' '}
          {torque(v, spec.targetUnit)}{' '}
          <span className="text-ink-2">
            ({convertedTorque(convertTorque(v, spec.targetUnit, spec.alt.unit), spec.alt.unit)})
          </span>
        </li>
      ))}
      {spec.finalAngleDeg != null && (
        <li>
          <span className="font-semibold">Then turn:</span> {exact(spec.finalAngleDeg)}°
        </li>
      )}
    </ol>
  );
}

/** A spec's target in both unit systems, its band, and the details from the service information. */
export function FastenerDetails({ spec }: { spec: FastenerSpec }) {
  return (
    <>
      <p className="mt-1 flex flex-wrap items-baseline gap-x-2 tabular-nums">
        <span className="text-2xl font-bold text-ink">{targetText(spec)}</span>
        <span className="text-lg font-semibold text-ink-2">({altTargetText(spec)})</span>
      </p>
      <p className="text-[15px] text-ink-2 tabular-nums">
        In spec from {bandText(spec)} ({altBandText(spec)})
      </p>
      <dl className="mt-2 divide-y divide-rule border-y border-rule text-[15px]">
        {(spec.stages.length > 0 || spec.finalAngleDeg != null) && (
          <Detail term="Stages">
            <StagesText spec={spec} />
          </Detail>
        )}
        <Detail term="Threads">
          <span className="font-semibold">{threadConditionLabels[spec.threadCondition]}</span>
        </Detail>
        {spec.positionNames.length > 0 && (
          <Detail term="Positions">{spec.positionNames.join(', ')}</Detail>
        )}
        {spec.sequenceNote && (
          <Detail term="Sequence">
            <span className="whitespace-pre-line">{spec.sequenceNote}</span>
          </Detail>
        )}
        {spec.retorque.asked && (
          <Detail term="Re-torque">
            Re-check {spec.retorque.description}
            {spec.retorque.closedAt && (
              <span className="block text-ink-2">
                Closed by {spec.retorque.closedBy?.name ?? 'someone'},{' '}
                {formatWhen(spec.retorque.closedAt)}: “{spec.retorque.closeNote}”
              </span>
            )}
          </Detail>
        )}
        <Detail term="Spec from">{spec.specSource}</Detail>
      </dl>
      <p className="mt-2 flex gap-1.5 text-sm text-muted">
        <BookOpen aria-hidden className="mt-0.5 size-4 shrink-0" />
        Check this against the maker's service information before you torque: Headroom records the
        spec, it does not supply it.
      </p>
    </>
  );
}
