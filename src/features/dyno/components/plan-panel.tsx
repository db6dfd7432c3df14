import { Link } from 'react-router-dom';
import type { BestRun, SupportedComparison, TargetProgress } from '@shared/dyno';
import type { DynoFigure, DynoPlan, PowerBasis } from '@shared/schemas/dyno';
import { formatNumber } from '@shared/format';
import { Alert } from '@/components/ui/alert';
import { Badge } from '@/components/ui/badge';
import { paths } from '@/config/paths';
import { powerText, progressText } from '../format';
import { FiguresWorking } from './working';
import { ProgressBar } from './progress-bar';

function basisNote(from: PowerBasis, to: PowerBasis, lossPct: number, achievedHp: number) {
  if (from === to) return null;
  return `As ${to} hp: ${formatNumber(achievedHp, 1)}, moved from the ${from} figure with the build’s ${formatNumber(lossPct, 1)} % drivetrain-loss assumption.`;
}

/**
 * The best corrected result against the build's target and against what the estimator says
 * the rated parts support, each in the target's basis.
 */
export function AgainstPlan({
  buildId,
  best,
  bestLabel,
  vsTarget,
  vsSupported,
  plan,
  standardLabel,
  impliedLoss,
  lossFigures,
}: {
  buildId: string;
  best: BestRun | null;
  /** "Run 2", or "Run 2 on 14 Nov 2026" across sessions. */
  bestLabel: string;
  vsTarget: TargetProgress | null;
  vsSupported: SupportedComparison | null;
  plan: DynoPlan;
  standardLabel: string;
  impliedLoss?: { loss: DynoFigure; message: string | null; text: string } | null;
  lossFigures?: DynoFigure[];
}) {
  const target = plan.target;
  if (!best || !vsTarget) {
    return (
      <p className="text-ink-2">
        No complete run with a peak power yet: the target of{' '}
        <strong>
          {formatNumber(target.powerHp, 1)} {target.basis} hp
        </strong>{' '}
        is compared once there is one.
      </p>
    );
  }
  const pct = vsTarget.progressPct.value;
  const note = basisNote(best.basis, target.basis, plan.drivetrainLossPct, vsTarget.achieved.value);
  const figures: DynoFigure[] = [best.peakPower, vsTarget.achieved, vsTarget.progressPct];
  if (vsSupported) figures.push(vsSupported.pctOfSupported);
  return (
    <div className="flex flex-col gap-4" data-testid="against-plan">
      <div>
        <p className="text-sm font-semibold tracking-wide text-muted uppercase">
          Best run · {standardLabel}
        </p>
        <p className="text-2xl font-bold tabular-nums text-ink">
          {powerText(best.peakPowerHp, 'hp', best.basis)}
        </p>
        <p className="text-ink-2">{bestLabel}</p>
      </div>
      <div className="flex flex-col gap-1.5">
        <div className="flex flex-wrap items-baseline justify-between gap-2">
          <p className="font-semibold text-ink">
            {progressText(pct, vsTarget.reached)} of the {formatNumber(target.powerHp, 1)}{' '}
            {target.basis} hp target
          </p>
          {vsTarget.reached ? (
            <Badge tone="ok">Target reached</Badge>
          ) : (
            <span className="text-ink-2 tabular-nums">
              {formatNumber(vsTarget.remainingHp, 1)} {target.basis} hp to go
            </span>
          )}
        </div>
        <ProgressBar pct={pct} label="Progress toward the target" />
        {note && <p className="text-sm text-muted">{note}</p>}
      </div>
      {vsSupported ? (
        <div className="flex flex-col gap-1">
          <p className="text-ink-2">
            <strong className="text-ink tabular-nums">
              {formatNumber(vsSupported.pctOfSupported.value, 1)} %
            </strong>{' '}
            of the{' '}
            {formatNumber(
              target.basis === 'crank'
                ? (plan.supported?.crankPowerHp ?? 0)
                : (plan.supported?.wheelPowerHp ?? 0),
              1,
            )}{' '}
            {target.basis} hp the rated parts support
            {plan.supported?.limitedBy ? ` (weakest link: ${plan.supported.limitedBy})` : ''}.
          </p>
          {vsSupported.beyondSupported && (
            <Alert tone="warning" title="Past what the rated parts support">
              This result is above the most the estimate says the build’s rated parts hold. Check
              the ratings and the estimate’s assumptions before asking for more; a part past its
              rating can fail without warning.
            </Alert>
          )}
        </div>
      ) : (
        <p className="text-sm text-muted">
          No rated parts, so there is no “most the build supports” to compare with.{' '}
          <Link
            to={paths.builds.estimate.getHref(buildId)}
            className="font-semibold text-accent-700 underline"
          >
            Power estimate
          </Link>
        </p>
      )}
      {impliedLoss && (
        <div className="flex flex-col gap-1" data-testid="implied-loss">
          <p className="text-ink-2">{impliedLoss.text}</p>
          {impliedLoss.message && <Alert tone="warning">{impliedLoss.message}</Alert>}
        </div>
      )}
      <FiguresWorking
        figures={[...figures, ...(lossFigures ?? [])]}
        label="the comparison with the target"
      />
    </div>
  );
}
