import { verdictLabels } from '@shared/install-log/torque';
import type { FastenerSpec } from '@shared/schemas/install-log';
import { Spinner } from '@/components/ui/spinner';
import { cn } from '@/components/ui/cn';
import { useReadings } from '../api/get-readings';
import { readingConverted, torque, readingWhen } from '../lib/format';
import { formatWhen } from '@/lib/dates';
import { CalibrationFlag, VerdictBadge } from './reading-line';

/** Every reading of one position, newest first; replaced ones struck through but kept. */
export function PositionHistory({
  buildId,
  spec,
  position,
  label,
}: {
  buildId: string;
  spec: FastenerSpec;
  position: number;
  /** "#3", or the position's name. */
  label: string;
}) {
  const readings = useReadings(buildId, spec.id);
  if (readings.isPending) {
    return (
      <p role="status" className="flex items-center gap-2 py-2 text-muted">
        <Spinner className="size-5" /> Loading the history…
      </p>
    );
  }
  if (readings.isError) {
    return (
      <p role="alert" className="py-2 font-semibold text-over">
        Could not load the history: {readings.error.message}
      </p>
    );
  }
  const here = readings.data.readings
    .filter((r) => r.position === position)
    .sort((a, b) => b.recordedAt.localeCompare(a.recordedAt));
  if (here.length === 0) return <p className="py-2 text-muted">No readings yet.</p>;
  return (
    <ol aria-label={`History of ${label}`} className="mt-1 flex flex-col gap-2">
      {here.map((r) => {
        const replaced = r.supersededAt !== null;
        return (
          <li
            key={r.id}
            className={cn(
              'rounded-md border px-3 py-2',
              replaced ? 'border-rule bg-paper text-muted' : 'border-rule-strong bg-white',
            )}
          >
            <p className="flex flex-wrap items-center gap-x-2 gap-y-1">
              {replaced ? (
                <>
                  <s className="text-lg font-semibold tabular-nums">
                    {torque(r.value, r.unit)} = {readingConverted(r, spec)}
                  </s>
                  <span className="text-sm font-semibold">
                    <s>{verdictLabels[r.verdict]}</s> · replaced
                  </span>
                </>
              ) : (
                <>
                  <VerdictBadge verdict={r.verdict} />
                  <span className="text-lg font-semibold text-ink tabular-nums">
                    {torque(r.value, r.unit)}
                  </span>
                  <span className="tabular-nums">= {readingConverted(r, spec)}</span>
                  <span className="text-sm font-semibold text-ink-2">· current</span>
                </>
              )}
              {r.kind === 'retorque' && (
                <span className="rounded bg-ink/[0.06] px-1.5 text-sm font-semibold">Re-check</span>
              )}
              {r.stage != null && (
                <span className="rounded bg-ink/[0.06] px-1.5 text-sm font-semibold">
                  Stage {r.stage}
                </span>
              )}
            </p>
            <p className="text-sm">
              {r.recordedBy?.name ?? 'Someone'}, {readingWhen(r, formatWhen)}
              {r.wrench && <> · {r.wrench}</>}
            </p>
            {!replaced && <CalibrationFlag reading={r} />}
            {r.note && <p className="text-sm">“{r.note}”</p>}
          </li>
        );
      })}
    </ol>
  );
}
