import { useId, useState, type ReactNode } from 'react';
import { BookOpen, ChevronDown, History, Pencil, RotateCcw, Trash2 } from 'lucide-react';
import {
  threadConditionLabels,
  type FastenerPosition,
  type FastenerSpec,
} from '../../../../shared/schemas/install-log';
import { convertTorque, verdictLabels } from '../../../../shared/install-log/torque';
import { Button } from '../../../components/ui/button';
import { cn } from '../../../components/ui/cn';
import { TextInput } from '../../../components/ui/form-field';
import type { RecordedReading } from '../api/record-reading';
import {
  altBandText,
  altTargetText,
  bandText,
  convertedTorque,
  exact,
  targetText,
  torque,
} from '../lib/format';
import { formatWhen } from '../../../lib/dates';
import { useRememberedWrench } from '../lib/wrench-memory';
import { PositionHistory } from './position-history';
import { ReadingEntry, type EntryKind } from './reading-entry';
import { ReadingLine } from './reading-line';

type Mode = 'fitting' | 'retorque' | 'read-only';

function Detail({ term, children }: { term: string; children: ReactNode }) {
  return (
    <div className="grid grid-cols-[6.5rem_minmax(0,1fr)] gap-2 py-1.5 sm:grid-cols-[8rem_minmax(0,1fr)]">
      <dt className="font-semibold text-ink-2">{term}</dt>
      <dd className="min-w-0 text-ink">{children}</dd>
    </div>
  );
}

/** "15 lbf·ft (20.3 N·m) → 30 lbf·ft, then turn 90°" */
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

function PositionRow({
  buildId,
  spec,
  pos,
  mode,
  wrench,
  focus,
  onRecorded,
}: {
  buildId: string;
  spec: FastenerSpec;
  pos: FastenerPosition;
  mode: Mode;
  wrench: string;
  focus: boolean;
  onRecorded: (result: RecordedReading) => void;
}) {
  const [correcting, setCorrecting] = useState(false);
  const [showHistory, setShowHistory] = useState(false);
  const historyId = useId();
  const current = pos.current;
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
  const readings = (current ? 1 : 0) + (retorque ? 1 : 0) + pos.supersededCount;

  return (
    <li
      id={`fastener-${spec.id}-${pos.position}`}
      aria-label={`Position ${pos.position}`}
      className={cn(
        'border-l-4 px-4 py-3 sm:px-5',
        out || retorqueOut ? 'border-over bg-over-soft/60' : 'border-transparent',
      )}
    >
      <div className="flex items-start gap-2">
        <span
          className={cn(
            'w-10 shrink-0 text-xl font-bold text-ink tabular-nums',
            entry === 'first' ? 'pt-2.5' : 'pt-0.5',
          )}
        >
          #{pos.position}
        </span>
        {entry === 'first' ? (
          <div className="min-w-0 flex-1">
            <ReadingEntry
              buildId={buildId}
              spec={spec}
              position={pos.position}
              kind="first"
              layout="row"
              wrench={wrench}
              autoFocus={focus}
              onRecorded={onRecorded}
            />
          </div>
        ) : (
          <div className="flex min-w-0 flex-1 flex-col gap-2" aria-live="polite">
            {current ? (
              <ReadingLine reading={current} spec={spec} />
            ) : (
              <p className="pt-1 text-muted">No reading</p>
            )}
            {spec.retorque.asked && (mode === 'retorque' || retorque) && (
              <div className="border-t border-rule pt-2">
                {retorque ? (
                  <ReadingLine reading={retorque} spec={spec} label="Re-check" />
                ) : mode === 'retorque' ? (
                  <>
                    <p className="mb-1 font-semibold text-ink-2">Re-check:</p>
                    <ReadingEntry
                      buildId={buildId}
                      spec={spec}
                      position={pos.position}
                      kind="retorque"
                      layout="row"
                      wrench={wrench}
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
          buildId={buildId}
          spec={spec}
          position={pos.position}
          kind={entry}
          wrench={wrench}
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
              <span className="sr-only"> for #{pos.position}</span>
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
              <span className="sr-only"> of #{pos.position}</span>
              <ChevronDown
                aria-hidden
                className={cn('size-4 transition-transform', showHistory && 'rotate-180')}
              />
            </Button>
          )}
        </div>
      )}
      <div id={historyId}>
        {showHistory && <PositionHistory buildId={buildId} spec={spec} position={pos.position} />}
      </div>
    </li>
  );
}

/**
 * One fastener spec: the target in both unit systems, its band, stages, thread condition,
 * sequence and source, then a row per position to record what the wrench read.
 */
export function FastenerCard({
  buildId,
  spec,
  mode,
  onEdit,
  onDelete,
}: {
  buildId: string;
  spec: FastenerSpec;
  mode: Mode;
  onEdit?: () => void;
  onDelete?: () => void;
}) {
  const headingId = useId();
  const wrenchId = useId();
  const [wrench, setWrench] = useRememberedWrench();
  const [focusPosition, setFocusPosition] = useState<number | null>(null);
  const [announcement, setAnnouncement] = useState('');
  const recorded = spec.positions.filter((p) => p.current).length;
  const out = spec.positions.filter((p) => p.current && p.current.verdict !== 'in-spec').length;

  function afterRecord(result: RecordedReading) {
    const r = result.reading;
    setAnnouncement(
      `#${r.position}: ${torque(r.value, r.unit)}, ${verdictLabels[r.verdict].toLowerCase()}.`,
    );
    // In spec: move on to the next position without a reading. Out of spec: stay, so the
    // red verdict stays in view.
    if (r.verdict !== 'in-spec') return setFocusPosition(null);
    const retorque = r.kind === 'retorque';
    const next = result.fastener.positions.find(
      (p) => p.position > r.position && !(retorque ? p.retorque : p.current),
    );
    setFocusPosition(next?.position ?? null);
  }

  return (
    <section
      id={`fastener-${spec.id}`}
      aria-labelledby={headingId}
      className="scroll-mt-4 rounded-lg border border-rule-strong bg-sheet"
    >
      <div className="border-b border-rule px-4 py-3 sm:px-5">
        <div className="flex items-start justify-between gap-2">
          <h3 id={headingId} className="text-lg leading-snug font-bold text-ink">
            {spec.name}
            <span className="ml-1.5 font-semibold text-muted">× {spec.count}</span>
          </h3>
          {(onEdit || onDelete) && (
            <div className="-mt-1 -mr-2 flex shrink-0">
              {onEdit && (
                <button
                  type="button"
                  onClick={onEdit}
                  aria-label={`Edit the spec “${spec.name}”`}
                  className="inline-flex size-12 items-center justify-center rounded-md text-muted hover:bg-ink/5 hover:text-ink"
                >
                  <Pencil aria-hidden className="size-5" />
                </button>
              )}
              {onDelete && (
                <button
                  type="button"
                  onClick={onDelete}
                  aria-label={`Delete the spec “${spec.name}”`}
                  className="inline-flex size-12 items-center justify-center rounded-md text-muted hover:bg-over-soft hover:text-over"
                >
                  <Trash2 aria-hidden className="size-5" />
                </button>
              )}
            </div>
          )}
        </div>
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
      </div>

      {mode !== 'read-only' && (
        <div className="border-b border-rule px-4 py-3 sm:px-5">
          <label htmlFor={wrenchId} className="text-[15px] font-semibold text-ink">
            Wrench used <span className="font-normal text-muted">(remembered on this device)</span>
          </label>
          <TextInput
            id={wrenchId}
            value={wrench}
            onChange={(e) => setWrench(e.target.value)}
            autoComplete="off"
            placeholder="e.g. 3/8 in. click wrench, 10–80 lbf·ft"
            className="mt-1 min-h-12! sm:max-w-md"
          />
        </div>
      )}

      <p className="px-4 pt-3 text-[15px] font-semibold text-ink-2 sm:px-5">
        {recorded} of {spec.count} recorded
        {out > 0 && <span className="text-over"> · {out} out of spec</span>}
      </p>
      <p role="status" className="sr-only">
        {announcement}
      </p>
      <ol className="divide-y divide-rule">
        {spec.positions.map((p) => (
          <PositionRow
            key={p.position}
            buildId={buildId}
            spec={spec}
            pos={p}
            mode={mode}
            wrench={wrench}
            focus={focusPosition === p.position}
            onRecorded={afterRecord}
          />
        ))}
      </ol>
    </section>
  );
}
