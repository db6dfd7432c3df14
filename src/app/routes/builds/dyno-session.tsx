import { useMemo, useState } from 'react';
import { useParams } from 'react-router-dom';
import { FileUp, Gauge, ListOrdered, Pencil, Plus, Target, Trash2 } from 'lucide-react';
import { can } from '@shared/permissions';
import { correctionFactor, sessionReport } from '@shared/dyno';
import type { Build } from '@shared/schemas/builds';
import type { CorrectionChoice, DynoRun } from '@shared/schemas/dyno';
import { formatIsoDate } from '@shared/format';
import { PageHeader } from '@/app/layouts/page-header';
import { Badge } from '@/components/ui/badge';
import { Button, ButtonLink } from '@/components/ui/button';
import { Section } from '@/components/ui/card';
import { PageSpinner } from '@/components/ui/spinner';
import { EmptyState, ErrorState, NotFoundState } from '@/components/ui/states';
import { paths } from '@/config/paths';
import { isApiError } from '@/lib/api-client';
import { useBuild } from '@/features/builds/api/get-build';
import { useDeleteDynoRun } from '@/features/dyno/api/delete-dyno-run';
import { useDeleteDynoSession } from '@/features/dyno/api/delete-dyno-session';
import { useDynoSession, type DynoSessionAnswer } from '@/features/dyno/api/get-dyno-session';
import { useCorrectionChoice } from '@/features/dyno/choice';
import { choiceSearch } from '@/features/dyno/choice-search';
import { standardShortLabels } from '@shared/dyno/vocabulary';
import { DynoCautions } from '@/features/dyno/components/dyno-cautions';
import { AgainstPlan } from '@/features/dyno/components/plan-panel';
import { RunCard } from '@/features/dyno/components/run-card';
import { dynoKindShort, runColours } from '@/features/dyno/format';
import { SessionCurves, chartRunsOf } from '@/features/dyno/components/session-curves';
import { SessionCorrection } from '@/features/dyno/components/session-correction';
import { BuildLoadError } from './build-states';
import { SessionDialogs, type Dialog } from './dyno-session-dialogs';

/** "/builds/:buildId/dyno/:sessionId" — one dyno day: its runs, corrected, against the plan. */
export function DynoSessionRoute() {
  const { buildId = '', sessionId = '' } = useParams();
  const build = useBuild(buildId);
  const session = useDynoSession(buildId, sessionId);
  const [choice, setChoice] = useCorrectionChoice();

  if (build.isPending || session.isPending) return <PageSpinner label="Loading the dyno day…" />;
  if (build.isError) {
    return <BuildLoadError error={build.error} onRetry={() => void build.refetch()} />;
  }
  if (session.isError) {
    const back = (
      <ButtonLink to={paths.builds.dyno.getHref(buildId)} variant="secondary">
        Back to the dyno days
      </ButtonLink>
    );
    if (isApiError(session.error) && session.error.status === 404) {
      return (
        <>
          <title>Dyno session not found · Headroom</title>
          <NotFoundState title="Dyno session not found" titleAs="h1" actions={back}>
            It may have been deleted, or it is not one you can see.
          </NotFoundState>
        </>
      );
    }
    return (
      <ErrorState
        title="Could not load this dyno day"
        titleAs="h1"
        error={session.error}
        onRetry={() => void session.refetch()}
        actions={back}
      />
    );
  }
  return (
    <SessionPage build={build.data} data={session.data} choice={choice} onChoice={setChoice} />
  );
}

function SessionPage({
  build,
  data,
  choice,
  onChoice,
}: {
  build: Build;
  data: DynoSessionAnswer;
  choice: CorrectionChoice;
  onChoice: (c: CorrectionChoice) => void;
}) {
  const { session, runs, plan } = data;
  const role = build.myRole;
  const canWrite = can(role, 'dyno:write');
  const canDelete = can(role, 'dyno:delete');
  const [dialog, setDialog] = useState<Dialog>(null);
  const [chartOverride, setChartOverride] = useState<Record<string, boolean>>({});
  const deleteSession = useDeleteDynoSession();
  const deleteRun = useDeleteDynoRun();

  // The same computation the server makes, here so a new standard shows at once.
  const report = useMemo(
    () => sessionReport(session, runs, choice, plan),
    [session, runs, choice, plan],
  );
  const reportOf = new Map(report.runs.map((r) => [r.id, r]));
  const withCurves = runs.filter((r) => r.curve.length > 0);
  const colourOf = new Map(withCurves.map((r, i) => [r.id, runColours[i % runColours.length]]));
  const onChart = (r: DynoRun) => chartOverride[r.id] ?? r.status === 'complete';
  const chartRuns = chartRunsOf(withCurves.filter(onChart), report, colourOf);

  const bestRun = report.best ? runs.find((r) => r.id === report.best!.id) : undefined;
  const shownCorrection = bestRun
    ? reportOf.get(bestRun.id)!.corrected.correction
    : runs.length
      ? reportOf.get(runs[0].id)!.corrected.correction
      : correctionFactor({
          standard: choice.standard,
          weather: session.weather,
          r85: {
            aspiration: choice.aspiration ?? plan.engine.aspiration,
            chosenEngineFactor: choice.engineFactor ?? null,
          },
        });
  const correctionTitle = bestRun
    ? `Correction factor, best run (run ${bestRun.runNumber})`
    : runs.length
      ? `Correction factor, run ${runs[0].runNumber}`
      : 'Correction factor at the session’s weather';
  const standardName = standardShortLabels[choice.standard];
  const basis = report.basis;
  const search = choiceSearch(choice);
  const title = `Dyno day, ${formatIsoDate(session.date)}`;

  return (
    <>
      <title>{`${title} · ${build.name} · Headroom`}</title>
      <PageHeader
        back={{ to: `${paths.builds.dyno.getHref(build.id)}${search}`, label: 'Dyno days' }}
        title={title}
        subtitle={
          <span>
            {[
              session.place,
              dynoKindShort[session.dynoKind],
              session.runBy && `run by ${session.runBy}`,
            ]
              .filter(Boolean)
              .join(' · ')}
          </span>
        }
        badges={
          <>
            <Badge tone="neutral">{basis === 'wheel' ? 'Wheel figures' : 'Crank figures'}</Badge>
            {session.shop && <Badge tone="neutral">Shop: {session.shop.name}</Badge>}
          </>
        }
        actions={
          <>
            {canWrite && (
              <Button
                variant="secondary"
                icon={<Pencil aria-hidden className="size-4" />}
                onClick={() => setDialog({ kind: 'edit-session' })}
              >
                Edit session
              </Button>
            )}
            {canDelete && (
              <Button
                variant="secondary"
                icon={<Trash2 aria-hidden className="size-4 text-over" />}
                onClick={() => {
                  deleteSession.reset();
                  setDialog({ kind: 'delete-session' });
                }}
              >
                Delete session
              </Button>
            )}
          </>
        }
      />

      <div className="flex flex-col gap-5">
        {session.notes && <p className="whitespace-pre-line text-ink-2">{session.notes}</p>}

        <div className="grid gap-5 lg:grid-cols-2 lg:items-start">
          <SessionCorrection
            weather={session.weather}
            choice={choice}
            onChoice={onChoice}
            buildAspiration={plan.engine.aspiration}
            correction={shownCorrection}
            correctionTitle={correctionTitle}
          />

          <Section
            id="plan"
            title="Against the plan"
            icon={<Target aria-hidden className="size-5 text-accent-600" />}
          >
            <AgainstPlan
              buildId={build.id}
              best={report.best}
              bestLabel={
                bestRun
                  ? `Run ${bestRun.runNumber}${bestRun.tuneRevision ? `, tune ${bestRun.tuneRevision}` : ''}`
                  : ''
              }
              vsTarget={report.vsTarget}
              vsSupported={report.vsSupported}
              plan={plan}
              standardLabel={standardName}
            />
          </Section>
        </div>

        <SessionCurves
          hasCurves={withCurves.length > 0}
          chartRuns={chartRuns}
          report={report}
          plan={plan}
          dynoKind={session.dynoKind}
          standard={choice.standard}
        />

        <Section
          id="runs"
          title="Runs"
          icon={<ListOrdered aria-hidden className="size-5 text-ink-3" />}
          actions={
            canWrite ? (
              <div className="flex flex-wrap gap-2">
                <Button
                  size="sm"
                  icon={<FileUp aria-hidden className="size-4" />}
                  onClick={() => setDialog({ kind: 'import-run' })}
                >
                  Import a run from CSV
                </Button>
                <Button
                  size="sm"
                  variant="secondary"
                  icon={<Plus aria-hidden className="size-4" />}
                  onClick={() => setDialog({ kind: 'new-run' })}
                >
                  Type in a run
                </Button>
              </div>
            ) : undefined
          }
        >
          {runs.length === 0 ? (
            <EmptyState icon={<Gauge aria-hidden className="size-6" />} title="No runs yet">
              {canWrite
                ? 'Import each pull from the dyno’s CSV file, or type in its peaks from the screen or the printout.'
                : 'The runs of this dyno day show here once they are recorded.'}
            </EmptyState>
          ) : (
            <div className="flex flex-col gap-3">
              {runs.map((r) => (
                <RunCard
                  key={r.id}
                  run={r}
                  report={reportOf.get(r.id)!}
                  best={report.best?.id === r.id}
                  colour={colourOf.get(r.id) ?? null}
                  onChart={onChart(r)}
                  onToggleChart={(on) => setChartOverride((o) => ({ ...o, [r.id]: on }))}
                  buildId={build.id}
                  actions={{
                    onEdit: canWrite ? () => setDialog({ kind: 'edit-run', run: r }) : undefined,
                    onReplaceCurve: canWrite
                      ? () => setDialog({ kind: 'replace-curve', run: r })
                      : undefined,
                    onAttach: canWrite ? () => setDialog({ kind: 'attach', run: r }) : undefined,
                    onDelete: canDelete
                      ? () => {
                          deleteRun.reset();
                          setDialog({ kind: 'delete-run', run: r });
                        }
                      : undefined,
                  }}
                />
              ))}
            </div>
          )}
        </Section>

        <DynoCautions />
      </div>

      <SessionDialogs
        dialog={dialog}
        onClose={() => setDialog(null)}
        build={build}
        session={session}
        runCount={runs.length}
        backHref={`${paths.builds.dyno.getHref(build.id)}${search}`}
        deleteSession={deleteSession}
        deleteRun={deleteRun}
      />
    </>
  );
}
