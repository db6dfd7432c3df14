import { Link } from 'react-router-dom';
import type { IsoDate } from '@shared/dates';
import type { Timeline, TimelineItem } from '@shared/schemas/timeline';
import { Badge } from '@/components/ui/badge';
import { cn } from '@/components/ui/cn';
import { kindLooks } from './kinds';
import { milestoneElementId, timelineHref } from './links';

const monthName = new Intl.DateTimeFormat('en-US', {
  month: 'long',
  year: 'numeric',
  timeZone: 'UTC',
});
const weekday = new Intl.DateTimeFormat('en-US', { weekday: 'short', timeZone: 'UTC' });
const utc = (d: IsoDate) => new Date(`${d}T00:00:00Z`);

function Row({ buildId, item }: { buildId: string; item: TimelineItem }) {
  const look = kindLooks[item.kind];
  const Icon = look.icon;
  const isTarget = item.kind === 'target';
  return (
    <li
      id={
        item.link.to === 'milestone'
          ? `${milestoneElementId(item.link.milestoneId)}-date`
          : undefined
      }
      className={cn(
        'flex items-start gap-3 py-2.5',
        isTarget && '-mx-2 rounded-md bg-ink/[0.05] px-2',
        item.threatened && '-mx-2 rounded-md bg-over-soft/60 px-2',
      )}
    >
      <time
        dateTime={item.date}
        className="flex w-11 shrink-0 flex-col items-center rounded border border-rule bg-white py-0.5 leading-tight"
      >
        <span className="text-xs text-muted uppercase">{weekday.format(utc(item.date))}</span>
        <span className="text-lg font-bold tabular-nums">{Number(item.date.slice(8))}</span>
      </time>
      <div className="min-w-0 flex-1">
        <p className="flex items-center gap-1.5 text-sm text-muted">
          <Icon aria-hidden className="size-4 shrink-0" />
          {item.detail}
        </p>
        {isTarget || item.link.to === 'milestone' ? (
          <p className="font-semibold break-words text-ink">{item.title}</p>
        ) : (
          <Link
            to={timelineHref(buildId, item.link)}
            className="font-semibold break-words text-accent-700 underline"
          >
            {item.title}
          </Link>
        )}
      </div>
      {item.threatened && (
        <Badge tone="over" className="shrink-0">
          At risk
        </Badge>
      )}
      {item.done && (
        <Badge tone="ok" className="shrink-0">
          Done
        </Badge>
      )}
    </li>
  );
}

function Months({ buildId, items }: { buildId: string; items: TimelineItem[] }) {
  const months = new Map<string, TimelineItem[]>();
  for (const i of items) {
    const key = i.date.slice(0, 7);
    months.set(key, [...(months.get(key) ?? []), i]);
  }
  return (
    <div className="flex flex-col gap-4">
      {[...months].map(([key, list]) => (
        <section key={key} aria-label={monthName.format(utc(`${key}-01`))}>
          <h3 className="mb-1 text-sm font-bold tracking-wide text-ink-3 uppercase">
            {monthName.format(utc(`${key}-01`))}
          </h3>
          <ol className="flex flex-col divide-y divide-rule">
            {list.map((i) => (
              <Row key={i.key} buildId={buildId} item={i} />
            ))}
          </ol>
        </section>
      ))}
    </div>
  );
}

/**
 * The dated items month by month from today; what is behind us (done, or passed without a
 * threat) folds away under "Earlier".
 */
export function Agenda({ buildId, timeline }: { buildId: string; timeline: Timeline }) {
  const ahead = timeline.items.filter((i) => i.date >= timeline.today || i.threatened);
  const earlier = timeline.items.filter((i) => i.date < timeline.today && !i.threatened);
  return (
    <div className="flex flex-col gap-4">
      {ahead.length ? (
        <Months buildId={buildId} items={ahead} />
      ) : (
        <p className="text-muted">Nothing dated from today on.</p>
      )}
      {earlier.length > 0 && (
        <details className="rounded-md border border-rule px-3 py-2">
          <summary className="min-h-11 cursor-pointer content-center font-semibold text-ink-2">
            Earlier ({earlier.length})
          </summary>
          <div className="pt-2">
            <Months buildId={buildId} items={earlier} />
          </div>
        </details>
      )}
    </div>
  );
}
