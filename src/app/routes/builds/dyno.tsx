import { useState } from 'react';
import { Link, useNavigate, useParams } from 'react-router-dom';
import { CalendarDays, ChevronRight, Gauge, Plus, Target } from 'lucide-react';
import { can } from '@shared/permissions';
import type { Build } from '@shared/schemas/builds';
import type { DynoSessionSummary } from '@shared/schemas/dyno';
import { formatIsoDate, formatNumber } from '@shared/format';
import { PageHeader } from '@/app/layouts/page-header';
import { Badge } from '@/components/ui/badge';
import { Button } from '@/components/ui/button';
import { Section } from '@/components/ui/card';
import { PageSpinner, Spinner } from '@/components/ui/spinner';
import { EmptyState, ErrorState } from '@/components/ui/states';
import { paths } from '@/config/paths';
import { useBuild } from '@/features/builds/api/get-build';
import { useDynoSessions, type DynoSessionsAnswer } from '@/features/dyno/api/get-dyno-sessions';
import { useCorrectionChoice } from '@/features/dyno/choice';
import { choiceSearch } from '@/features/dyno/choice-search';
import { StandardPicker } from '@/features/dyno/components/correction-panel';
import { standardShortLabels } from '@shared/dyno/vocabulary';
import { DynoCautions } from '@/features/dyno/components/dyno-cautions';
import { AgainstPlan } from '@/features/dyno/components/plan-panel';
import { SessionFormDialog } from '@/features/dyno/components/session-form';
import { dynoKindShort, factorText, powerText, rpmText, torqueText } from '@/features/dyno/format';
import { BuildLoadError } from './build-states';

/** "/builds/:buildId/dyno" — the build's dyno days and its best result against the plan. */
export function DynoRoute() {
  const { buildId = '' } = useParams();
  const build = useBuild(buildId);
  if (build.isPending) return <PageSpinner label="Loading the build…" />;
  if (build.isError) {
    return <BuildLoadError error={build.error} onRetry={() => void build.refetch()} />;
  }
  return <DynoPage build={build.data} />;
}

function SessionRow({
  s,
  search,
  buildId,
}: {
  s: DynoSessionSummary;
  search: string;
  buildId: string;
}) {
  const best = s.best;
  return (
    <li>
      <Link
        to={paths.builds.dynoSession.getHref(buildId, s.id, search)}
        className="group flex items-start gap-3 rounded-lg border border-rule bg-sheet px-4 py-3 hover:border-ink-3 sm:px-5"
      >
        <CalendarDays aria-hidden className="mt-1 size-5 shrink-0 text-ink-3" />
        <div className="min-w-0 flex-1">
          <p className="flex flex-wrap items-center gap-x-2 gap-y-1">
            <span className="text-lg font-bold text-ink group-hover:underline">
              {formatIsoDate(s.date)}
            </span>
            <Badge tone="neutral">{dynoKindShort[s.dynoKind]}</Badge>
            {s.shop && <Badge tone="neutral">Shop: {s.shop.name}</Badge>}
          </p>
          <p className="text-ink-2">
            {[
              s.place,
              `${s.runCount} ${s.runCount === 1 ? 'run' : 'runs'}`,
              !s.weather && 'no weather recorded',
            ]
              .filter(Boolean)
              .join(' · ')}
          </p>
          {best && best.peakPower != null && best.peakPowerRpm != null ? (
            <p className="mt-1 text-ink tabular-nums">
              Best: <strong>{powerText(best.peakPower, best.powerUnit, best.basis)}</strong> at{' '}
              {rpmText(best.peakPowerRpm)}
              {best.peakTorque != null && best.peakTorqueRpm != null && (
                <span className="text-ink-2">
                  {' '}
                  · {torqueText(best.peakTorque, best.torqueUnit)} at {rpmText(best.peakTorqueRpm)}
                </span>
              )}
              <span className="block text-sm text-muted">
                Run {best.runNumber} · factor {factorText(best.factor)}
                {!best.applied ? ' (no weather: as measured)' : ''}
                {!best.valid ? ' · outside the standard’s range' : ''}
              </span>
            </p>
          ) : (
            <p className="mt-1 text-muted">No complete run yet</p>
          )}
        </div>
        <ChevronRight aria-hidden className="mt-1 size-5 shrink-0 text-ink-3" />
      </Link>
    </li>
  );
}

function impliedLossText(summary: DynoSessionsAnswer['summary'], lossPct: number) {
  const { impliedLoss, bestCrank, bestWheel } = summary;
  if (!impliedLoss || !bestCrank || !bestWheel) return null;
  return {
    ...impliedLoss,
    text: `The best engine-dyno figure (${formatNumber(bestCrank.peakPowerHp, 1)} crank hp, ${formatIsoDate(bestCrank.date)}) and the best chassis-dyno figure (${formatNumber(bestWheel.peakPowerHp, 1)} wheel hp, ${formatIsoDate(bestWheel.date)}), corrected alike, imply a drivetrain loss of ${formatNumber(impliedLoss.loss.value, 1)} %; the estimate assumes ${formatNumber(lossPct, 1)} %. They compare fairly only on the same engine and tune.`,
  };
}

function DynoPage({ build }: { build: Build }) {
  const [choice, setChoice] = useCorrectionChoice();
  const sessions = useDynoSessions(build.id, choice);
  const navigate = useNavigate();
  const [adding, setAdding] = useState(false);
  const canWrite = can(build.myRole, 'dyno:write');
  const search = choiceSearch(choice);

  const header = (
    <>
      <title>{`Dyno · ${build.name} · Headroom`}</title>
      <PageHeader
        title="Dyno days"
        subtitle={<span>{build.name}</span>}
        badges={
          sessions.isFetching && !sessions.isPending ? (
            <span className="flex items-center gap-1.5 text-sm text-muted" role="status">
              <Spinner className="size-4" /> Updating…
            </span>
          ) : undefined
        }
        actions={
          // With no session yet, the empty state below carries the button.
          canWrite && sessions.data?.sessions.length !== 0 ? (
            <Button icon={<Plus aria-hidden className="size-4" />} onClick={() => setAdding(true)}>
              New dyno session
            </Button>
          ) : undefined
        }
      />
      <SessionFormDialog
        open={adding}
        buildId={build.id}
        canAssign={can(build.myRole, 'dyno:assign')}
        onClose={() => setAdding(false)}
        onSaved={(s) => {
          setAdding(false);
          navigate(paths.builds.dynoSession.getHref(build.id, s.id, search));
        }}
      />
    </>
  );

  if (sessions.isPending) {
    return (
      <>
        {header}
        <PageSpinner label="Loading the dyno days…" />
      </>
    );
  }
  if (sessions.isError) {
    return (
      <>
        {header}
        <ErrorState
          title="Could not load the dyno days"
          error={sessions.error}
          onRetry={() => void sessions.refetch()}
        />
      </>
    );
  }
  const { summary, plan } = sessions.data;
  const list = sessions.data.sessions;
  const best = summary.best;

  return (
    <>
      {header}
      <div className="flex flex-col gap-5">
        {build.myRole === 'shop' && (
          <p className="text-[15px] text-muted">
            You see the dyno sessions assigned to you (your dyno), and those you record here.
          </p>
        )}
        {list.length === 0 ? (
          <EmptyState
            icon={<Gauge aria-hidden className="size-6" />}
            title={build.myRole === 'shop' ? 'No dyno days for you yet' : 'No dyno days yet'}
            actions={
              canWrite ? (
                <Button
                  icon={<Plus aria-hidden className="size-4" />}
                  onClick={() => setAdding(true)}
                >
                  New dyno session
                </Button>
              ) : undefined
            }
          >
            {build.myRole === 'shop'
              ? 'Sessions the owner or crew assign to you, and those you record at your dyno, show here. '
              : ''}
            A dyno day holds its pulls, the weather they were made in and each pull’s curve. Runs
            are kept as measured and corrected to a standard on the page, so days compare.
          </EmptyState>
        ) : (
          <>
            <div className="grid gap-5 lg:grid-cols-2 lg:items-start">
              <Section
                id="plan"
                title="Against the plan"
                icon={<Target aria-hidden className="size-5 text-accent-600" />}
              >
                <div className="flex flex-col gap-4">
                  <StandardPicker
                    key={choice.standard}
                    choice={choice}
                    onChange={setChoice}
                    buildAspiration={plan.engine.aspiration}
                  />
                  <AgainstPlan
                    buildId={build.id}
                    best={best}
                    bestLabel={
                      best
                        ? `Run ${best.runNumber ?? ''} on ${formatIsoDate(best.date)}, ${dynoKindShort[best.dynoKind].toLowerCase()}`
                        : ''
                    }
                    vsTarget={summary.vsTarget}
                    vsSupported={summary.vsSupported}
                    plan={plan}
                    standardLabel={standardShortLabels[choice.standard]}
                    impliedLoss={impliedLossText(summary, plan.drivetrainLossPct)}
                    lossFigures={summary.impliedLoss ? [summary.impliedLoss.loss] : []}
                  />
                </div>
              </Section>
              <DynoCautions />
            </div>
            <Section
              id="sessions"
              title="Sessions"
              icon={<CalendarDays aria-hidden className="size-5 text-ink-3" />}
              actions={<Badge tone="neutral">{standardShortLabels[choice.standard]}</Badge>}
            >
              <ul className="flex flex-col gap-3">
                {list.map((s) => (
                  <SessionRow key={s.id} s={s} search={search} buildId={build.id} />
                ))}
              </ul>
            </Section>
          </>
        )}
        {list.length === 0 && <DynoCautions />}
      </div>
    </>
  );
}
