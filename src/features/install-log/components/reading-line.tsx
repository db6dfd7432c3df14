import { ArrowDown, ArrowUp, Check, TriangleAlert } from 'lucide-react';
import { formatIsoDate } from '@shared/format';
import { verdictLabels, type Verdict } from '@shared/install-log/torque';
import type { FastenerSpec, TorqueReading } from '@shared/schemas/install-log';
import { cn } from '@/components/ui/cn';
import { deviationText, readingConverted, torque, readingWhen } from '../lib/format';
import { formatWhen } from '@/lib/dates';

const verdictIcons = { 'in-spec': Check, under: ArrowDown, over: ArrowUp } as const;

/** In spec (green, tick), Under spec (red, arrow down), Over spec (red, arrow up). */
export function VerdictBadge({ verdict, className }: { verdict: Verdict; className?: string }) {
  const Icon = verdictIcons[verdict];
  return (
    <span
      className={cn(
        'inline-flex items-center gap-1 rounded-md px-2 py-0.5 text-base font-bold whitespace-nowrap',
        verdict === 'in-spec' ? 'bg-ok text-white' : 'bg-over text-white',
        className,
      )}
    >
      <Icon aria-hidden className="size-4" strokeWidth={3} />
      {verdictLabels[verdict]}
    </span>
  );
}

/** "Wrench due for calibration 14 Mar 2026" on a reading taken with a wrench past its date. */
export function CalibrationFlag({ reading }: { reading: TorqueReading }) {
  const c = reading.calibration;
  if (!c?.overdue || !c.dueOn) return null;
  return (
    <p className="mt-0.5 flex items-start gap-1.5 text-sm font-semibold text-[#6b4408]">
      <TriangleAlert aria-hidden className="mt-0.5 size-4 shrink-0 text-tight" />
      Wrench was due for calibration {formatIsoDate(c.dueOn)}: worth checking with a calibrated one.
    </p>
  );
}

/** A reading: verdict, value as read, the converted value, who, when and with what. */
export function ReadingLine({
  reading,
  spec,
  label,
}: {
  reading: TorqueReading;
  spec: FastenerSpec;
  /** e.g. "Re-check" for a re-torque reading. */
  label?: string;
}) {
  const deviation = deviationText(reading, spec);
  return (
    <div className="min-w-0">
      <p className="flex flex-wrap items-center gap-x-2 gap-y-1">
        {label && <span className="font-semibold text-ink-2">{label}:</span>}
        <VerdictBadge verdict={reading.verdict} />
        <span className="text-xl font-bold text-ink tabular-nums">
          {torque(reading.value, reading.unit)}
        </span>
        <span className="text-ink-2 tabular-nums">= {readingConverted(reading, spec)}</span>
      </p>
      {deviation && <p className="mt-0.5 text-[15px] font-semibold text-[#7d1f17]">{deviation}</p>}
      <p className="mt-0.5 text-sm text-muted">
        {reading.recordedBy?.name ?? 'Someone'}, {readingWhen(reading, formatWhen)}
        {reading.wrench && <> · {reading.wrench}</>}
      </p>
      <CalibrationFlag reading={reading} />
      {reading.note && <p className="text-sm text-ink-2">“{reading.note}”</p>}
    </div>
  );
}
