import { lazy, Suspense } from 'react';
import { Activity } from 'lucide-react';
import type { SessionReport } from '@shared/dyno';
import { standardShortLabels } from '@shared/dyno/vocabulary';
import type { CorrectionStandard, DynoKind, DynoPlan, DynoRun } from '@shared/schemas/dyno';
import { convertPower, convertTorque } from '@shared/units/convert';
import { formatNumber } from '@shared/format';
import { Badge } from '@/components/ui/badge';
import { Section } from '@/components/ui/card';
import { PageSpinner } from '@/components/ui/spinner';
import type { ChartRun } from './curve-chart';
import { basisWords, dynoKindShort } from '../format';

/** The runs to draw, corrected, in hp and lbf·ft, each in its colour. */
export function chartRunsOf(
  runs: DynoRun[],
  report: SessionReport,
  colourOf: Map<string, string>,
): ChartRun[] {
  const reportOf = new Map(report.runs.map((r) => [r.id, r]));
  return runs.map((r) => {
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
}

// recharts is the heaviest thing here: the figures arrive first, the chart after.
const RunCurves = lazy(() => import('./curve-chart').then((m) => ({ default: m.RunCurves })));

/** The session's curves on one chart, corrected to the chosen standard, with the target drawn. */
export function SessionCurves({
  hasCurves,
  chartRuns,
  report,
  plan,
  dynoKind,
  standard,
}: {
  hasCurves: boolean;
  chartRuns: ChartRun[];
  report: SessionReport;
  plan: DynoPlan;
  dynoKind: DynoKind;
  standard: CorrectionStandard;
}) {
  const basis = report.basis;
  const targetMoved = plan.target.basis !== basis;
  const standardName = standardShortLabels[standard];
  return (
    <Section
      id="curves"
      title="Curves"
      icon={<Activity aria-hidden className="size-5 text-accent-600" />}
      actions={
        <Badge tone="neutral">
          {standard === 'uncorrected' ? 'As measured' : `Corrected: ${standardName}`}
        </Badge>
      }
    >
      {!hasCurves ? (
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
            {dynoKindShort[dynoKind]}, so {basisWords[dynoKind]}. The dashed line is the target,{' '}
            {targetMoved
              ? `${formatNumber(plan.target.powerHp, 1)} ${plan.target.basis} hp drawn as ${formatNumber(report.targetPower.value, 1)} ${basis} hp with the build’s ${formatNumber(plan.drivetrainLossPct, 1)} % drivetrain-loss assumption`
              : `${formatNumber(plan.target.powerHp, 1)} ${plan.target.basis} hp`}
            . Curves {standard === 'uncorrected' ? 'as measured' : `corrected to ${standardName}`},
            in hp and lbf·ft.
          </figcaption>
        </figure>
      )}
    </Section>
  );
}
