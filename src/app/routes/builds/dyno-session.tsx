import { lazy, Suspense, useMemo, useState } from 'react';
import { useNavigate, useParams } from 'react-router-dom';
import {
  Activity,
  CloudSun,
  FileUp,
  Gauge,
  ListOrdered,
  Pencil,
  Plus,
  Target,
  Trash2,
} from 'lucide-react';
import { can } from '../../../../shared/permissions';
import { correctionFactor, sessionReport } from '../../../../shared/dyno';
import { convertPower, convertTorque } from '../../../../shared/units/convert';
import type { Build } from '../../../../shared/schemas/builds';
import type { CorrectionChoice, DynoRun } from '../../../../shared/schemas/dyno';
import { formatIsoDate, formatNumber } from '../../../../shared/format';
import { PageHeader } from '../../../components/layouts/page-header';
import { Alert } from '../../../components/ui/alert';
import { Badge } from '../../../components/ui/badge';
import { Button, ButtonLink } from '../../../components/ui/button';
import { Section } from '../../../components/ui/card';
import { ConfirmDialog } from '../../../components/ui/confirm-dialog';
import { PageSpinner } from '../../../components/ui/spinner';
import { EmptyState, ErrorState, NotFoundState } from '../../../components/ui/states';
import { paths } from '../../../config/paths';
import { isApiError } from '../../../lib/api-client';
import { useBuild } from '../../../features/builds/api/get-build';
import { useDeleteDynoRun } from '../../../features/dyno/api/delete-dyno-run';
import { useDeleteDynoSession } from '../../../features/dyno/api/delete-dyno-session';
import {
  useDynoSession,
  type DynoSessionAnswer,
} from '../../../features/dyno/api/get-dyno-session';
import { useCorrectionChoice } from '../../../features/dyno/choice';
import { choiceSearch } from '../../../features/dyno/choice-search';
import { AttachmentDialog } from '../../../features/dyno/components/attachment-dialog';
import {
  CorrectionFigure,
  StandardPicker,
} from '../../../features/dyno/components/correction-panel';
import { standardShortLabels } from '../../../../shared/dyno/vocabulary';
import type { ChartRun } from '../../../features/dyno/components/curve-chart';
import { DynoCautions } from '../../../features/dyno/components/dyno-cautions';
import { ImportRunDialog } from '../../../features/dyno/components/import-run';
import { AgainstPlan } from '../../../features/dyno/components/plan-panel';
import { RunCard } from '../../../features/dyno/components/run-card';
import { RunFormDialog } from '../../../features/dyno/components/run-form';
import { SessionFormDialog } from '../../../features/dyno/components/session-form';
import { basisWords, dynoKindShort, runColours, weatherText } from '../../../features/dyno/format';
import { BuildLoadError } from './build-states';

// recharts is the heaviest thing here: the figures arrive first, the chart after.
const RunCurves = lazy(() =>
  import('../../../features/dyno/components/curve-chart').then((m) => ({ default: m.RunCurves })),
);

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

type Dialog =
  | { kind: 'edit-session' }
  | { kind: 'delete-session' }
  | { kind: 'new-run' }
  | { kind: 'import-run' }
  | { kind: 'edit-run'; run: DynoRun }
  | { kind: 'replace-curve'; run: DynoRun }
  | { kind: 'attach'; run: DynoRun }
  | { kind: 'delete-run'; run: DynoRun }
  | null;

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
  const navigate = useNavigate();
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
  const chartRuns: ChartRun[] = withCurves.filter(onChart).map((r) => {
    const c = reportOf.get(r.id)!.corrected;
    return {
      id: r.id,
      label: `Run ${r.runNumber}`,
      colour: colourOf.get(r.id)!,
      points: c.curve.map((p) => ({
        rpm: p.rpm,
        hp: convertPower(p.power, c.powerUnit, 'hp'),
        lbft: convertTorque(p.torque, c.torqueUnit, 'lbf-ft'),
      })),
    };
  });

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
  const targetMoved = plan.target.basis !== basis;
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
          <Section
            id="correction"
            title="Weather and correction"
            icon={<CloudSun aria-hidden className="size-5 text-ink-3" />}
          >
            <div className="flex flex-col gap-4">
              <p className="text-ink-2" data-testid="session-weather">
                {session.weather ? (
                  <>
                    <strong className="text-ink">At the session:</strong>{' '}
                    {weatherText(session.weather)}
                  </>
                ) : (
                  'No weather recorded for the session: runs without their own stay as measured.'
                )}
              </p>
              <StandardPicker
                key={choice.standard}
                choice={choice}
                onChange={onChoice}
                buildAspiration={plan.engine.aspiration}
              />
              <CorrectionFigure correction={shownCorrection} title={correctionTitle} />
            </div>
          </Section>

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

        <Section
          id="curves"
          title="Curves"
          icon={<Activity aria-hidden className="size-5 text-accent-600" />}
          actions={
            <Badge tone="neutral">
              {choice.standard === 'uncorrected' ? 'As measured' : `Corrected: ${standardName}`}
            </Badge>
          }
        >
          {withCurves.length === 0 ? (
            <p className="text-ink-2">
              No run has a curve yet. Import one from the dyno’s CSV file to see power and torque
              against rpm.
            </p>
          ) : chartRuns.length === 0 ? (
            <p className="text-ink-2">
              No run is chosen for the chart: tick “On the chart” on a run below.
            </p>
          ) : (
            <figure className="flex flex-col gap-3" data-testid="dyno-chart">
              <Suspense fallback={<PageSpinner label="Drawing the curves…" />}>
                <RunCurves
                  runs={chartRuns}
                  basis={basis}
                  targetHp={report.targetPower.value}
                  targetLbft={report.targetTorque?.value ?? null}
                />
              </Suspense>
              <figcaption className="text-[15px] text-ink-2">
                {dynoKindShort[session.dynoKind]}, so {basisWords[session.dynoKind]}. The dashed
                line is the target,{' '}
                {targetMoved
                  ? `${formatNumber(plan.target.powerHp, 1)} ${plan.target.basis} hp drawn as ${formatNumber(report.targetPower.value, 1)} ${basis} hp with the build’s ${formatNumber(plan.drivetrainLossPct, 1)} % drivetrain-loss assumption`
                  : `${formatNumber(plan.target.powerHp, 1)} ${plan.target.basis} hp`}
                . Curves{' '}
                {choice.standard === 'uncorrected' ? 'as measured' : `corrected to ${standardName}`}
                , in hp and lbf·ft.
              </figcaption>
            </figure>
          )}
        </Section>

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

      <SessionFormDialog
        open={dialog?.kind === 'edit-session'}
        buildId={build.id}
        session={session}
        canAssign={can(role, 'dyno:assign')}
        onClose={() => setDialog(null)}
        onSaved={() => setDialog(null)}
      />
      <RunFormDialog
        open={dialog?.kind === 'new-run' || dialog?.kind === 'edit-run'}
        buildId={build.id}
        sessionId={session.id}
        run={dialog?.kind === 'edit-run' ? dialog.run : undefined}
        onClose={() => setDialog(null)}
        onSaved={() => setDialog(null)}
      />
      <ImportRunDialog
        open={dialog?.kind === 'import-run' || dialog?.kind === 'replace-curve'}
        buildId={build.id}
        sessionId={session.id}
        replace={dialog?.kind === 'replace-curve' ? dialog.run : undefined}
        onClose={() => setDialog(null)}
        onSaved={() => setDialog(null)}
      />
      {dialog?.kind === 'attach' && (
        <AttachmentDialog
          open
          buildId={build.id}
          run={dialog.run}
          onClose={() => setDialog(null)}
        />
      )}
      <ConfirmDialog
        open={dialog?.kind === 'delete-session'}
        title="Delete this dyno session?"
        confirmLabel="Yes, delete"
        pending={deleteSession.isPending}
        onClose={() => setDialog(null)}
        onConfirm={() =>
          deleteSession.mutate(
            { buildId: build.id, sessionId: session.id },
            {
              onSuccess: () =>
                navigate(`${paths.builds.dyno.getHref(build.id)}${search}`, { replace: true }),
            },
          )
        }
      >
        <p>
          The session, its {runs.length === 1 ? 'run' : `${runs.length} runs`} and their attached
          files go for good.
        </p>
        {deleteSession.isError && (
          <Alert tone="error" className="mt-3">
            {deleteSession.error.message}
          </Alert>
        )}
      </ConfirmDialog>
      <ConfirmDialog
        open={dialog?.kind === 'delete-run'}
        title={
          dialog?.kind === 'delete-run' ? `Delete run ${dialog.run.runNumber}?` : 'Delete run?'
        }
        confirmLabel="Yes, delete"
        pending={deleteRun.isPending}
        onClose={() => setDialog(null)}
        onConfirm={() => {
          if (dialog?.kind !== 'delete-run') return;
          deleteRun.mutate(
            { buildId: build.id, runId: dialog.run.id },
            { onSuccess: () => setDialog(null) },
          );
        }}
      >
        <p>
          The run, its curve and its attached file go for good. The other runs keep their numbers.
        </p>
        {deleteRun.isError && (
          <Alert tone="error" className="mt-3">
            {deleteRun.error.message}
          </Alert>
        )}
      </ConfirmDialog>
    </>
  );
}
