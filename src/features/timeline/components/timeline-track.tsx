import { daysBetween, shortDate } from '@shared/dates';
import type { Timeline, TimelineItem } from '@shared/schemas/timeline';
import { cn } from '@/components/ui/cn';
import { kindLooks } from './kinds';

// Today sits at 0 %, the target at `end` %; what falls after the target shares the last strip.
const end = 86;
const after = 95;

function place(date: string, today: string, days: number): number {
  const d = daysBetween(today, date);
  if (d <= 0) return 0;
  if (d > days) return after;
  return (d / days) * end;
}

/** The first day of each month between today and the target, for the ticks under the line. */
function monthStarts(today: string, target: string): string[] {
  const out: string[] = [];
  let [y, m] = today.split('-').map(Number);
  for (let i = 0; i < 24; i++) {
    m += 1;
    if (m > 12) {
      m = 1;
      y += 1;
    }
    const first = `${y}-${String(m).padStart(2, '0')}-01`;
    if (first > target) break;
    out.push(first);
  }
  return out;
}

/**
 * The road from today to the target date, drawn with CSS: the buffer before the target
 * shaded, each dated item a dot (red ring when threatened), items past the target in a strip
 * after it. A picture only: the list beside it says the same in words.
 */
export function TimelineTrack({ timeline }: { timeline: Timeline }) {
  const { today, target } = timeline;
  if (!target.date || target.date < today) return null;
  const days = Math.max(1, daysBetween(today, target.date));
  const upcoming = timeline.items.filter(
    (i) => i.kind !== 'target' && (i.date >= today || i.threatened),
  );
  // Dots close together stack upward instead of hiding each other.
  const stacks = new Map<number, number>();
  const dots = upcoming.map((item: TimelineItem) => {
    const x = place(item.date, today, days);
    const bucket = Math.round(x / 3);
    const level = stacks.get(bucket) ?? 0;
    stacks.set(bucket, level + 1);
    return { item, x, level: Math.min(level, 3) };
  });
  const cutoffX = target.cutoff ? place(target.cutoff, today, days) : end;
  const months = monthStarts(today, target.date);
  const label =
    months.length > 6
      ? (d: string) => shortDate(d).split(' ')[0][0]
      : (d: string) => shortDate(d).split(' ')[0];
  const late = upcoming.filter((i) => i.threatened).length;

  return (
    <figure className="flex flex-col gap-2">
      <div aria-hidden className="relative h-24 select-none">
        {/* The buffer: from the cut-off to the target. */}
        {target.cutoff && cutoffX < end && (
          <>
            <div
              className="absolute top-10 h-6 rounded-sm bg-tight/25"
              style={{ left: `${cutoffX}%`, width: `${end - cutoffX}%` }}
            />
            <span className="absolute top-9 h-8 w-0.5 bg-tight" style={{ left: `${cutoffX}%` }} />
          </>
        )}
        <div className="absolute inset-x-0 top-[3.25rem] h-1 rounded bg-rule-strong" />
        <div
          className="absolute top-[3.25rem] h-1 rounded bg-ink-3"
          style={{ left: `${end}%`, width: `${100 - end}%`, opacity: 0.25 }}
        />
        <span className="absolute top-0 left-0 text-xs font-bold tracking-wide text-ink-2 uppercase">
          Today
        </span>
        <span className="absolute top-8 left-0 h-10 w-0.5 bg-ink" />
        <span
          className="absolute top-0 -translate-x-1/2 text-xs font-bold tracking-wide text-ink uppercase"
          style={{ left: `${end}%` }}
        >
          Target
        </span>
        <span className="absolute top-5 h-12 w-1 bg-ink" style={{ left: `calc(${end}% - 2px)` }} />
        {dots.map(({ item, x, level }) => (
          <span
            key={item.key}
            title={`${shortDate(item.date)}: ${item.title}`}
            className={cn(
              'absolute size-3.5 -translate-x-1/2 rounded-full border-2 border-sheet',
              kindLooks[item.kind].dot,
              item.threatened && 'ring-3 ring-over',
              item.done && 'opacity-50',
            )}
            style={{ left: `${Math.max(x, 1.2)}%`, top: `${3 - level * 0.95 + 0.15}rem` }}
          />
        ))}
        {months.map((m) => (
          <span
            key={m}
            className="absolute top-[4.25rem] -translate-x-1/2 text-xs text-muted"
            style={{ left: `${place(m, today, days)}%` }}
          >
            {label(m)}
          </span>
        ))}
      </div>
      <figcaption className="flex flex-wrap gap-x-4 gap-y-1 text-sm text-muted">
        <span>
          From today ({shortDate(today)}) to the target date ({shortDate(target.date)}):{' '}
          {upcoming.length} dated {upcoming.length === 1 ? 'item' : 'items'}
          {late ? `, ${late} at risk (ringed in red)` : ''}.
        </span>
        {target.cutoff && cutoffX < end && (
          <span>Shaded: the buffer from the parts cut-off to the target.</span>
        )}
      </figcaption>
    </figure>
  );
}
