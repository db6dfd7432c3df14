import { Link } from 'react-router-dom';
import { CalendarClock, ChevronRight } from 'lucide-react';
import { longDate } from '@shared/dates';
import { Section } from '@/components/ui/card';
import { Button } from '@/components/ui/button';
import { Spinner } from '@/components/ui/spinner';
import { paths } from '@/config/paths';
import { useTimeline } from '../api/get-timeline';
import { timelineHref } from './links';
import { ReadinessLine } from './readiness-line';
import { countdownOf, missLabel } from './words';

const shown = 3;

/** The overview's view of the timeline: the countdown, the readiness line and the worst threats. */
export function TimelineSummary({ buildId }: { buildId: string }) {
  const timeline = useTimeline(buildId);
  const open = (
    <Link
      to={paths.builds.timeline.getHref(buildId)}
      className="inline-flex min-h-11 items-center gap-1 font-semibold text-accent-700 hover:underline"
    >
      Open the timeline
      <ChevronRight aria-hidden className="size-4" />
    </Link>
  );
  let body;
  if (timeline.isPending) {
    body = (
      <p role="status" className="flex items-center gap-2 text-muted">
        <Spinner className="size-5" /> Counting the days…
      </p>
    );
  } else if (timeline.isError) {
    body = (
      <div role="alert" className="flex flex-wrap items-center gap-3 text-ink-2">
        <span>The timeline could not be loaded.</span>
        <Button variant="secondary" size="sm" onClick={() => void timeline.refetch()}>
          Try again
        </Button>
      </div>
    );
  } else {
    const t = timeline.data;
    const countdown = countdownOf(t);
    body = (
      <div className="flex flex-col gap-3">
        {countdown && t.target.date && (
          <p className="text-ink-2">
            <span className="text-2xl font-bold text-ink tabular-nums">{countdown}</span>
            <span className="block">
              {t.target.event ? `${t.target.event}, ` : 'Target date: '}
              <time dateTime={t.target.date}>{longDate(t.target.date)}</time>
            </span>
          </p>
        )}
        <ReadinessLine readiness={t.readiness} className="self-start" />
        {t.threats.length > 0 && (
          <ul className="flex flex-col gap-2">
            {t.threats.slice(0, shown).map((x) => (
              <li key={x.key} className="text-[15px] leading-snug">
                <Link
                  to={timelineHref(buildId, x.link)}
                  className="font-semibold text-accent-700 underline"
                >
                  {x.title}
                </Link>{' '}
                <span className="text-muted">({missLabel(x.missesByDays).toLowerCase()})</span>
              </li>
            ))}
            {t.threats.length > shown && (
              <li className="text-[15px] text-muted">and {t.threats.length - shown} more</li>
            )}
          </ul>
        )}
      </div>
    );
  }
  return (
    <Section
      id="timeline"
      title="Timeline"
      icon={<CalendarClock aria-hidden className="size-5 text-ink-3" />}
      actions={open}
    >
      {body}
    </Section>
  );
}
