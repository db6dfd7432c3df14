import type { ReactNode } from 'react';
import { ListChecks, Ruler, TriangleAlert } from 'lucide-react';
import type { StepProgress } from '@shared/schemas/install-log';
import { cn } from '@/components/ui/cn';

function Chip({
  icon,
  children,
  tone = 'neutral',
}: {
  icon: ReactNode;
  children: ReactNode;
  tone?: 'neutral' | 'ok' | 'over';
}) {
  return (
    <span
      className={cn(
        'inline-flex items-center gap-1 rounded px-2 py-0.5 text-sm font-semibold whitespace-nowrap tabular-nums',
        tone === 'neutral' && 'bg-ink/[0.06] text-ink-2',
        tone === 'ok' && 'bg-ok-soft text-[#1d5434]',
        tone === 'over' && 'bg-over-soft text-[#7d1f17]',
      )}
    >
      {icon}
      {children}
    </span>
  );
}

/** "Checks 2/3 · Torque 6/8 · 1 out of spec" for one step. */
export function StepProgressChips({ progress }: { progress: StepProgress }) {
  const { checklistDone, checklistTotal, positionsRecorded, positionsTotal, outOfSpec } = progress;
  return (
    <span className="flex flex-wrap gap-1.5">
      {checklistTotal > 0 && (
        <Chip
          icon={<ListChecks aria-hidden className="size-4" />}
          tone={checklistDone === checklistTotal ? 'ok' : 'neutral'}
        >
          Checks {checklistDone}/{checklistTotal}
        </Chip>
      )}
      {positionsTotal > 0 && (
        <Chip
          icon={<Ruler aria-hidden className="size-4" />}
          tone={positionsRecorded === positionsTotal && outOfSpec === 0 ? 'ok' : 'neutral'}
        >
          Torqued {positionsRecorded}/{positionsTotal}
        </Chip>
      )}
      {outOfSpec > 0 && (
        <Chip icon={<TriangleAlert aria-hidden className="size-4" />} tone="over">
          {outOfSpec} out of spec
        </Chip>
      )}
    </span>
  );
}
