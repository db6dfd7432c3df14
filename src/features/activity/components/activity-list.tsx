import { useId, useState } from 'react';
import { Link } from 'react-router-dom';
import {
  Camera,
  CircleCheck,
  Droplets,
  History,
  PackageCheck,
  ShieldAlert,
  ShoppingCart,
  Truck,
  Undo2,
  Wrench,
  type LucideIcon,
} from 'lucide-react';
import { addDays, buildToday } from '@shared/dates';
import { formatIsoDate } from '@shared/format';
import type { ActivityEvent, ActivityKind } from '@shared/schemas/activity';
import type { Build } from '@shared/schemas/builds';
import { Button } from '@/components/ui/button';
import { Section } from '@/components/ui/card';
import { cn } from '@/components/ui/cn';
import { PageSpinner } from '@/components/ui/spinner';
import { ErrorState } from '@/components/ui/states';
import { paths } from '@/config/paths';
import { useActivity } from '../api/get-activity';

const icons: Record<ActivityKind, LucideIcon> = {
  'part-ordered': ShoppingCart,
  'part-arrived': PackageCheck,
  'part-sent-out': Truck,
  'part-back': Undo2,
  'part-installed': Wrench,
  'step-signed-off': CircleCheck,
  'photos-added': Camera,
  'bench-sheet-added': Droplets,
};

/** The event in words: "Head studs arrived", "Teddy Brandt signed off Seat the injectors". */
function sentence(e: ActivityEvent): string {
  const name = e.subject.name;
  const who = e.by?.name ?? 'Someone';
  switch (e.kind) {
    case 'part-ordered':
      return `${name} ordered`;
    case 'part-arrived':
      return `${name} arrived`;
    case 'part-sent-out':
      return `${name} went out to ${e.shopName ?? 'a shop'}`;
    case 'part-back':
      return `${name} came back from ${e.shopName ?? 'the shop'}`;
    case 'part-installed':
      return `${name} installed`;
    case 'step-signed-off':
      return `${who} signed off “${name}”${e.overridden ? ' over open items' : ''}`;
    case 'photos-added':
      return `${who} added ${e.count === 1 ? 'a photo' : `${e.count} photos`} to “${name}”`;
    case 'bench-sheet-added':
      return `Bench sheet “${e.occasion ?? ''}” for ${name}`;
  }
}

function hrefOf(buildId: string, e: ActivityEvent): string {
  if (e.subject.type === 'step') return paths.builds.step.getHref(buildId, e.subject.id);
  if (e.kind === 'bench-sheet-added') return paths.builds.bench.getHref(buildId);
  if (e.kind === 'photos-added') return paths.builds.photos.getHref(buildId);
  if (e.kind === 'part-sent-out' || e.kind === 'part-back')
    return paths.builds.sendOuts.getHref(buildId);
  return paths.builds.parts.getHref(buildId);
}

/** "Today", "Yesterday" (the build's days, as the server dates its events), or the date. */
function dayLabel(day: string, today: string): string {
  if (day === today) return 'Today';
  if (day === addDays(today, -1)) return 'Yesterday';
  return formatIsoDate(day);
}

/** How many entries show before "Show all": a phone screen's worth, the rest one tap away. */
const firstShown = 5;

/**
 * "Lately": what has happened on the build, newest first — parts moving, steps signed off,
 * photos and bench sheets — as the member's role may see it (the server filters; no money).
 */
export function ActivityList({ build }: { build: Pick<Build, 'id' | 'timeZone'> }) {
  const buildId = build.id;
  const activity = useActivity(buildId);
  const today = buildToday(build);
  const [showAll, setShowAll] = useState(false);
  const listId = useId();
  let body;
  if (activity.isPending) body = <PageSpinner label="Loading what happened lately…" />;
  else if (activity.isError)
    body = (
      <ErrorState
        title="Could not load what happened lately"
        error={activity.error}
        onRetry={() => void activity.refetch()}
      />
    );
  else if (activity.data.length === 0)
    body = (
      <p className="text-muted">
        Nothing yet. Parts arriving, steps signed off and photos added show here.
      </p>
    );
  else {
    const events = showAll ? activity.data : activity.data.slice(0, firstShown);
    const more = activity.data.length - firstShown;
    body = (
      <>
        <ol id={listId} aria-label="Recent activity" className="-my-1 divide-y divide-rule">
          {events.map((e, i) => {
            const Icon = e.overridden ? ShieldAlert : icons[e.kind];
            return (
              <li key={`${e.kind}-${e.subject.id}-${e.day}-${i}`}>
                <Link
                  to={hrefOf(buildId, e)}
                  className="flex min-h-12 items-start gap-3 py-2.5 hover:bg-ink/[0.03]"
                >
                  <Icon
                    aria-hidden
                    className={cn(
                      'mt-0.5 size-5 shrink-0',
                      e.overridden ? 'text-tight' : 'text-ink-3',
                    )}
                  />
                  <span className="min-w-0 flex-1 break-words text-ink">{sentence(e)}</span>
                  <span className="shrink-0 text-sm whitespace-nowrap text-muted">
                    {dayLabel(e.day, today)}
                  </span>
                </Link>
              </li>
            );
          })}
        </ol>
        {more > 0 && (
          <Button
            variant="secondary"
            size="sm"
            className="mt-3"
            aria-expanded={showAll}
            aria-controls={listId}
            onClick={() => setShowAll((v) => !v)}
          >
            {showAll ? 'Show fewer' : `Show ${more} more`}
          </Button>
        )}
      </>
    );
  }
  return (
    <Section
      id="lately"
      title="Lately"
      icon={<History aria-hidden className="size-5 text-ink-3" />}
    >
      {body}
    </Section>
  );
}
