import { useId, useState } from 'react';
import { ChevronDown, History, RotateCcw } from 'lucide-react';
import { positionLabel } from '@shared/install-log/positions';
import type { FastenerPosition, FastenerSpec } from '@shared/schemas/install-log';
import { Button } from '@/components/ui/button';
import { cn } from '@/components/ui/cn';
import type { RecordedReading } from '../api/record-reading';
import { torque } from '../lib/format';
import { PositionHistory } from './position-history';
import { ReadingEntry, type EntryKind } from './reading-entry';
import { ReadingLine } from './reading-line';

export type Mode = 'fitting' | 'retorque' | 'read-only';

/** "Stages: 41 ✓ · 80 ✓" under a final reading, when stages were recorded. */
function StagesSoFar({ spec, pos }: { spec: FastenerSpec; pos: FastenerPosition }) {
  if (!pos.stages.some(Boolean)) return null;
  return (
    <p className="text-sm text-ink-2 tabular-nums">
      {pos.stages.map((r, i) => (
        <span key={i} className={cn(r && r.verdict !== 'in-spec' && 'font-semibold text-over')}>
          {i > 0 && ' · '}
          Stage {i + 1}:{' '}
          {r ? `${torque(r.value, r.unit)} ${r.verdict === 'in-spec' ? '✓' : '✗'}` : '—'}
        </span>
      ))}
      <span className="sr-only"> of {spec.name}</span>
    </p>
  );
}

/**
 * One position of a fastener: its reading at the stage the card is on (or the final
 * torque), an entry when it has none, and its history. `stage` null is the final torque.
 */
export function PositionRow({
  buildId,
  spec,
  pos,
  mode,
  stage,
  wrenchId,
  focus,
  onRecorded,
}: {
  buildId: string;
  spec: FastenerSpec;
  pos: FastenerPosition;
  mode: Mode;
  stage: number | null;
  wrenchId: string;
  focus: boolean;
  onRecorded: (result: RecordedReading) => void;
}) {
  const [correcting, setCorrecting] = useState(false);
  const [showHistory, setShowHistory] = useState(false);
  const historyId = useId();
  const label = positionLabel(spec.positionNames, pos.position);
  const atStage = stage != null && mode === 'fitting';
  const current = atStage ? (pos.stages[stage - 1] ?? null) : pos.current;
  const retorque = pos.retorque;
  const out = current && current.verdict !== 'in-spec';
  const retorqueOut = retorque && retorque.verdict !== 'in-spec';

  let entry: EntryKind | null = null;
  if (mode === 'fitting') entry = !current ? 'first' : correcting ? 'correction' : null;
  // A first re-check sits in the row above; this form is for redoing one.
  if (mode === 'retorque') entry = retorqueOut || correcting ? 'retorque' : null;
  const canCorrect =
    (mode === 'fitting' && current && !correcting) ||
    (mode === 'retorque' && retorque && !retorqueOut && !correcting);
  const readings =
    (pos.current ? 1 : 0) +
    (retorque ? 1 : 0) +
    pos.stages.filter(Boolean).length +
    pos.supersededCount;
  const entryProps = {
    buildId,
    spec,
    position: pos.position,
    label,
    stage: atStage ? stage : null,
    wrenchId,
  };

  return (
    <li
      id={`fastener-${spec.id}-${pos.position}`}
      aria-label={`Position ${spec.positionNames[pos.position - 1] ?? pos.position}`}
      className={cn(
        'border-l-4 px-4 py-3 sm:px-5',
        out || retorqueOut ? 'border-over bg-over-soft/60' : 'border-transparent',
      )}
    >
      <div className="flex items-start gap-2">
        <span
          className={cn(
            'shrink-0 font-bold text-ink tabular-nums',
            label.length > 4 ? 'w-14 text-base leading-tight' : 'w-10 text-xl',
            entry === 'first' ? 'pt-2.5' : 'pt-0.5',
          )}
        >
          {label}
        </span>
        {entry === 'first' ? (
          <div className="min-w-0 flex-1">
            <ReadingEntry
              {...entryProps}
              kind="first"
              layout="row"
              autoFocus={focus}
              onRecorded={onRecorded}
            />
            {atStage && pos.current && (
              <p className="mt-1 text-sm text-muted">
                Final already read: {torque(pos.current.value, pos.current.unit)}
              </p>
            )}
            {!atStage && (
              <div className="mt-1">
                <StagesSoFar spec={spec} pos={pos} />
              </div>
            )}
          </div>
        ) : (
          <div className="flex min-w-0 flex-1 flex-col gap-2" aria-live="polite">
            {current ? (
              <ReadingLine
                reading={current}
                spec={spec}
                label={atStage ? `Stage ${stage}` : undefined}
              />
            ) : (
              <p className="pt-1 text-muted">No reading</p>
            )}
            {!atStage && <StagesSoFar spec={spec} pos={pos} />}
            {spec.retorque.asked && (mode === 'retorque' || retorque) && (
              <div className="border-t border-rule pt-2">
                {retorque ? (
                  <ReadingLine reading={retorque} spec={spec} label="Re-check" />
                ) : mode === 'retorque' ? (
                  <>
                    <p className="mb-1 font-semibold text-ink-2">Re-check:</p>
                    <ReadingEntry
                      {...entryProps}
                      kind="retorque"
                      layout="row"
                      autoFocus={focus}
                      onRecorded={onRecorded}
                    />
                  </>
                ) : (
                  <p className="text-muted">Re-check: not yet</p>
                )}
              </div>
            )}
          </div>
        )}
      </div>

      {entry && entry !== 'first' && (
        <ReadingEntry
          key={entry}
          {...entryProps}
          kind={entry}
          autoFocus={focus || correcting}
          onRecorded={(result) => {
            setCorrecting(false);
            onRecorded(result);
          }}
          onCancel={correcting ? () => setCorrecting(false) : undefined}
        />
      )}

      {(canCorrect || readings > 0) && (
        <div className="mt-2 flex flex-wrap gap-2">
          {canCorrect && (
            <Button
              variant="secondary"
              size="sm"
              className="min-h-12!"
              icon={<RotateCcw aria-hidden className="size-4" />}
              onClick={() => setCorrecting(true)}
            >
              {mode === 'retorque' ? 'Record another re-check' : 'Record a correction'}
              <span className="sr-only"> for {label}</span>
            </Button>
          )}
          {readings > 0 && (
            <Button
              variant="ghost"
              size="sm"
              className="min-h-12!"
              aria-expanded={showHistory}
              aria-controls={historyId}
              icon={<History aria-hidden className="size-4" />}
              onClick={() => setShowHistory((v) => !v)}
            >
              History{pos.supersededCount > 0 && ` (${pos.supersededCount} replaced)`}
              <span className="sr-only"> of {label}</span>
              <ChevronDown
                aria-hidden
                className={cn('size-4 transition-transform', showHistory && 'rotate-180')}
              />
            </Button>
          )}
        </div>
      )}
      <div id={historyId}>
        {showHistory && (
          <PositionHistory buildId={buildId} spec={spec} position={pos.position} label={label} />
        )}
      </div>
    </li>
  );
}
