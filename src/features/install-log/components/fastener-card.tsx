import { useId, useState } from 'react';
import { Pencil, Trash2 } from 'lucide-react';
import { positionLabel } from '@shared/install-log/positions';
import { verdictLabels } from '@shared/install-log/torque';
import type { FastenerSpec } from '@shared/schemas/install-log';
import { cn } from '@/components/ui/cn';
import type { RecordedReading } from '../api/record-reading';
import { torque } from '../lib/format';
import { useRememberedWrench } from '../lib/wrench-memory';
import { FastenerDetails } from './fastener-details';
import { PositionRow, type Mode } from './position-row';
import { WrenchPicker } from './wrench-picker';

/** The first stage some position still lacks a reading for, else the final torque (null). */
function nextStage(spec: FastenerSpec): number | null {
  for (let i = 0; i < spec.stages.length; i++) {
    if (spec.positions.some((p) => !p.stages[i] && !p.current)) return i + 1;
  }
  return null;
}

/** Stage 1 · Stage 2 · Final: which torque the crew is reading now, for every position. */
function StagePicker({
  spec,
  stage,
  onChange,
}: {
  spec: FastenerSpec;
  stage: number | null;
  onChange: (stage: number | null) => void;
}) {
  const choices = [
    ...spec.stages.map((v, i) => ({ stage: i + 1, value: v })),
    {
      stage: null,
      value: spec.targetValue,
    },
  ];
  return (
    <fieldset>
      <legend className="text-[15px] font-semibold text-ink">Reading now</legend>
      <div className="mt-1 grid grid-cols-[repeat(auto-fit,minmax(6.5rem,1fr))] gap-1.5 sm:max-w-xl">
        {choices.map((c) => {
          const done = spec.positions.filter((p) =>
            c.stage ? p.stages[c.stage - 1] : p.current,
          ).length;
          const on = c.stage === stage;
          return (
            <label
              key={c.stage ?? 'final'}
              className={cn(
                'flex min-h-12 cursor-pointer flex-col justify-center rounded-md border px-2.5 py-1 leading-tight has-[:focus-visible]:outline-3 has-[:focus-visible]:outline-accent-500',
                on ? 'border-ink bg-ink text-white' : 'border-rule-strong bg-white text-ink',
              )}
            >
              <input
                type="radio"
                name={`stage-${spec.id}`}
                className="sr-only"
                checked={on}
                onChange={() => onChange(c.stage)}
              />
              <span className="font-semibold">{c.stage ? `Stage ${c.stage}` : 'Final'}</span>
              <span className={cn('text-sm tabular-nums', on ? 'text-white/80' : 'text-muted')}>
                {torque(c.value, spec.targetUnit)} · {done}/{spec.count}
              </span>
            </label>
          );
        })}
      </div>
    </fieldset>
  );
}

/**
 * One fastener spec: the target in both unit systems, its band, stages, thread condition,
 * sequence and source, then a row per position to record what the wrench read — at each
 * stage when the spec has stages, and with which of my wrenches.
 */
export function FastenerCard({
  buildId,
  spec,
  mode,
  calibrationMonths,
  onEdit,
  onDelete,
}: {
  buildId: string;
  spec: FastenerSpec;
  mode: Mode;
  /** The build's wrench calibration interval, to say whether my wrench is due. */
  calibrationMonths: number;
  onEdit?: () => void;
  onDelete?: () => void;
}) {
  const headingId = useId();
  const [wrenchId, setWrenchId] = useRememberedWrench();
  // Until someone picks a stage, the card follows the work: the first stage not yet read.
  const [picked, setPicked] = useState<number | null | undefined>(undefined);
  const stage = mode === 'fitting' ? (picked !== undefined ? picked : nextStage(spec)) : null;
  const [focusPosition, setFocusPosition] = useState<number | null>(null);
  const [announcement, setAnnouncement] = useState('');
  const [warnings, setWarnings] = useState<string[]>([]);
  const recorded = spec.positions.filter((p) => p.current).length;
  const out = spec.positions.filter((p) => p.current && p.current.verdict !== 'in-spec').length;

  function afterRecord(result: RecordedReading) {
    const r = result.reading;
    setWarnings(result.warnings ?? []);
    setAnnouncement(
      `${positionLabel(spec.positionNames, r.position)}${r.stage ? ` stage ${r.stage}` : ''}: ${torque(r.value, r.unit)}, ${verdictLabels[r.verdict].toLowerCase()}.`,
    );
    // In spec: move on to the next position without a reading. Out of spec: stay, so the
    // red verdict stays in view.
    if (r.verdict !== 'in-spec') return setFocusPosition(null);
    const next = result.fastener.positions.find(
      (p) =>
        p.position > r.position &&
        !(r.kind === 'retorque' ? p.retorque : r.stage ? p.stages[r.stage - 1] : p.current),
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
        <FastenerDetails spec={spec} />
      </div>

      {mode !== 'read-only' && (
        <div className="flex flex-col gap-3 border-b border-rule px-4 py-3 sm:px-5">
          <WrenchPicker
            value={wrenchId}
            onChange={setWrenchId}
            calibrationMonths={calibrationMonths}
          />
          {mode === 'fitting' && spec.stages.length > 0 && (
            <StagePicker spec={spec} stage={stage} onChange={setPicked} />
          )}
        </div>
      )}

      <p className="px-4 pt-3 text-[15px] font-semibold text-ink-2 sm:px-5">
        {recorded} of {spec.count} {spec.stages.length ? 'at final torque' : 'recorded'}
        {out > 0 && <span className="text-over"> · {out} out of spec</span>}
      </p>
      {warnings.map((w) => (
        <p
          key={w}
          role="status"
          className="mx-4 mt-2 rounded-md border border-tight/40 bg-tight-soft px-3 py-2 text-[15px] font-semibold text-[#6b4408] sm:mx-5"
        >
          {w}
        </p>
      ))}
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
            stage={stage}
            wrenchId={wrenchId}
            focus={focusPosition === p.position}
            onRecorded={afterRecord}
          />
        ))}
      </ol>
    </section>
  );
}
