import { CircleCheck, CalendarX2, Hourglass, TriangleAlert } from 'lucide-react';
import type { Readiness } from '@shared/schemas/timeline';
import { cn } from '@/components/ui/cn';

const looks: Record<Readiness['state'], { icon: typeof CircleCheck; className: string }> = {
  'on-track': { icon: CircleCheck, className: 'bg-ok-soft text-[#1d5434] border-ok/40' },
  threatened: { icon: TriangleAlert, className: 'bg-over-soft text-[#7d1f17] border-over/40' },
  'no-target': { icon: CalendarX2, className: 'bg-ink/[0.05] text-ink-2 border-rule-strong' },
  passed: { icon: Hourglass, className: 'bg-ink/[0.05] text-ink-2 border-rule-strong' },
};

/** "On track" or "2 things threaten the date", as the server judged it. */
export function ReadinessLine({
  readiness,
  className,
}: {
  readiness: Readiness;
  className?: string;
}) {
  const { icon: Icon, className: look } = looks[readiness.state];
  return (
    <p
      className={cn(
        'inline-flex items-center gap-2 rounded-md border px-3 py-1.5 text-lg font-bold',
        look,
        className,
      )}
    >
      <Icon aria-hidden className="size-5 shrink-0" />
      {readiness.words}
    </p>
  );
}
