import { useEffect } from 'react';
import { Link, useLocation, useParams } from 'react-router-dom';
import { CalendarDays, Settings2, TriangleAlert } from 'lucide-react';
import { longDate, deviceTimeZone } from '@shared/dates';
import { capabilities } from '@shared/permissions';
import type { Build } from '@shared/schemas/builds';
import type { Timeline } from '@shared/schemas/timeline';
import { PageHeader } from '@/app/layouts/page-header';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { Section } from '@/components/ui/card';
import { PageSpinner } from '@/components/ui/spinner';
import { ErrorState } from '@/components/ui/states';
import { textLinkClasses } from '@/components/ui/text-link';
import { paths } from '@/config/paths';
import { useBuild } from '@/features/builds/api/get-build';
import { useTimeline } from '@/features/timeline/api/get-timeline';
import { useUpdateTimelineSettings } from '@/features/timeline/api/update-timeline-settings';
import { Agenda } from '@/features/timeline/components/agenda';
import { CalendarPanel } from '@/features/timeline/components/calendar-panel';
import { MilestonesPanel } from '@/features/timeline/components/milestones-panel';
import { ReadinessLine } from '@/features/timeline/components/readiness-line';
import { RulesNote } from '@/features/timeline/components/rules-note';
import { SettingsForm } from '@/features/timeline/components/settings-form';
import { ThreatsList } from '@/features/timeline/components/threats-list';
import { TimelineTrack } from '@/features/timeline/components/timeline-track';
import { countdownOf } from '@/features/timeline/components/words';
import { BuildLoadError } from './build-states';

/** "/builds/:buildId/timeline": the countdown, what threatens the date, and every dated item. */
export function TimelineRoute() {
  const { buildId = '' } = useParams();
  const build = useBuild(buildId);
  if (build.isPending) return <PageSpinner label="Loading the build…" />;
  if (build.isError) {
    return <BuildLoadError error={build.error} onRetry={() => void build.refetch()} />;
  }
  return <TimelinePage build={build.data} />;
}

function Countdown({ build, timeline: t }: { build: Build; timeline: Timeline }) {
  const countdown = countdownOf(t);
  return (
    <Section
      id="countdown"
      title="Countdown"
      icon={<CalendarDays aria-hidden className="size-5 text-accent-600" />}
    >
      <div className="flex flex-col gap-3">
        {countdown && t.target.date ? (
          <div>
            <p className="text-4xl leading-none font-bold tabular-nums text-ink">{countdown}</p>
            <p className="mt-1.5 text-lg text-ink-2">
              {t.target.event ? `${t.target.event}, ` : 'Target date: '}
              <time dateTime={t.target.date}>{longDate(t.target.date)}</time>
            </p>
          </div>
        ) : (
          <p className="text-lg text-ink-2">
            No target date yet.{' '}
            {capabilities(build.myRole).canEditBuild && (
              <Link to={paths.builds.edit.getHref(build.id)} className={textLinkClasses}>
                Set one
              </Link>
            )}
          </p>
        )}
        <ReadinessLine readiness={t.readiness} className="self-start" />
        {t.target.cutoff && (
          <p className="text-ink-2">
            Parts and send-outs due back by{' '}
            <strong>
              <time dateTime={t.target.cutoff}>{longDate(t.target.cutoff)}</time>
            </strong>{' '}
            ({t.settings.bufferDays}-day buffer).
          </p>
        )}
        <TimelineTrack timeline={t} />
      </div>
    </Section>
  );
}

function ZonePrompt({ buildId }: { buildId: string }) {
  const update = useUpdateTimelineSettings();
  const here = deviceTimeZone();
  return (
    <Alert tone="info" title="Days are counted in UTC until you choose the build’s time zone">
      <div className="flex flex-wrap items-center gap-3 pt-1">
        {here && (
          <Button
            size="sm"
            pending={update.isPending}
            onClick={() => update.mutate({ buildId, input: { timeZone: here } })}
          >
            Use {here}
          </Button>
        )}
        <span>or choose one under Settings.</span>
      </div>
    </Alert>
  );
}

function ReadOnlySettings({ t, isShop }: { t: Timeline; isShop: boolean }) {
  return (
    <dl className="grid grid-cols-[auto_1fr] gap-x-4 gap-y-1 text-ink-2">
      <dt className="font-semibold text-ink">Time zone</dt>
      <dd>{t.timeZone}</dd>
      <dt className="font-semibold text-ink">Buffer</dt>
      <dd>
        {t.settings.bufferDays} {t.settings.bufferDays === 1 ? 'day' : 'days'} before the target
      </dd>
      {!isShop && (
        <>
          <dt className="font-semibold text-ink">Install pace</dt>
          <dd>
            {t.settings.stepsPerWeek === null
              ? 'Not set: jobs are not checked'
              : `${t.settings.stepsPerWeek} steps a week`}
          </dd>
        </>
      )}
    </dl>
  );
}

function TimelinePage({ build }: { build: Build }) {
  const timeline = useTimeline(build.id);
  const { hash } = useLocation();
  const { canChangeTimelineSettings, canEditMilestones } = capabilities(build.myRole);
  const isShop = build.myRole === 'shop';

  // A link to one milestone (#milestone-…) scrolls to it once the timeline is on the page.
  useEffect(() => {
    if (timeline.isSuccess && hash) document.getElementById(hash.slice(1))?.scrollIntoView();
  }, [timeline.isSuccess, hash]);

  let body;
  if (timeline.isPending) {
    body = <PageSpinner label="Counting the days…" />;
  } else if (timeline.isError) {
    body = (
      <ErrorState
        title="Could not load the timeline"
        error={timeline.error}
        onRetry={() => void timeline.refetch()}
      />
    );
  } else {
    const t = timeline.data;
    body = (
      <div className="flex flex-col gap-5">
        {canChangeTimelineSettings && !t.timeZoneChosen && <ZonePrompt buildId={build.id} />}
        <div className="grid gap-5 lg:grid-cols-[minmax(0,3fr)_minmax(0,2fr)] lg:items-start">
          <div className="flex min-w-0 flex-col gap-5">
            <Countdown build={build} timeline={t} />
            {t.threats.length > 0 && (
              <Section
                id="threats"
                title="What threatens the date"
                icon={<TriangleAlert aria-hidden className="size-5 text-over" />}
              >
                <ThreatsList buildId={build.id} threats={t.threats} />
              </Section>
            )}
            <Section
              id="dates"
              title="Dates"
              icon={<CalendarDays aria-hidden className="size-5 text-ink-3" />}
            >
              {t.items.length ? (
                <Agenda buildId={build.id} timeline={t} />
              ) : (
                <p className="text-muted">
                  Nothing dated yet. Expected dates on parts, send-outs with a turnaround
                  {isShop ? '' : ', milestones and install jobs with a pace'} show up here.
                </p>
              )}
            </Section>
            <RulesNote bufferDays={t.settings.bufferDays} />
          </div>
          <div className="flex min-w-0 flex-col gap-5">
            {t.milestones && (
              <MilestonesPanel
                buildId={build.id}
                milestones={t.milestones}
                today={t.today}
                canEdit={canEditMilestones}
              />
            )}
            <Section
              id="settings"
              title="Settings"
              icon={<Settings2 aria-hidden className="size-5 text-ink-3" />}
            >
              {canChangeTimelineSettings ? (
                <SettingsForm buildId={build.id} timeline={t} />
              ) : (
                <ReadOnlySettings t={t} isShop={isShop} />
              )}
            </Section>
            <CalendarPanel buildId={build.id} isShop={isShop} />
            {isShop && (
              <p className="rounded-lg border border-rule bg-sheet/70 px-4 py-3 text-[15px] text-ink-2">
                As a shop, you see the target date and the parts sent to you.
              </p>
            )}
          </div>
        </div>
      </div>
    );
  }

  return (
    <>
      <title>{`Timeline · ${build.name} · Headroom`}</title>
      <PageHeader
        back={{ to: paths.builds.overview.getHref(build.id), label: build.name }}
        title="Timeline"
        subtitle={
          timeline.data ? (
            <span className="text-base text-muted">
              Today is {longDate(timeline.data.today)} in {timeline.data.timeZone}
            </span>
          ) : undefined
        }
      />
      {body}
    </>
  );
}
