import { Activity } from 'lucide-react';
import type { Build } from '@shared/schemas/builds';
import { DEFAULT_CORRECTION_STANDARD, standardShortLabels } from '@shared/dyno/vocabulary';
import { formatIsoDate, formatNumber } from '@shared/format';
import { Badge } from '@/components/ui/badge';
import { ButtonLink } from '@/components/ui/button';
import { Section } from '@/components/ui/card';
import { Spinner } from '@/components/ui/spinner';
import { paths } from '@/config/paths';
import { useDynoSessions } from '../api/get-dyno-sessions';
import { dynoKindShort, powerText, progressText } from '../format';
import { ProgressBar } from './progress-bar';

const choice = { standard: DEFAULT_CORRECTION_STANDARD };

/** The build overview's line on the dyno: the best corrected result against the target. */
export function DynoProgressSection({ build }: { build: Build }) {
  const sessions = useDynoSessions(build.id, choice);
  const link = (
    <ButtonLink to={paths.builds.dyno.getHref(build.id)} variant="ghost" size="sm">
      Dyno days
    </ButtonLink>
  );
  let body;
  if (sessions.isPending) {
    body = (
      <p role="status" className="flex items-center gap-2 text-muted">
        <Spinner className="size-5" /> Loading the dyno results…
      </p>
    );
  } else if (sessions.isError) {
    body = (
      <p className="text-muted">The dyno results could not be loaded: {sessions.error.message}</p>
    );
  } else if (!sessions.data.summary.best || !sessions.data.summary.vsTarget) {
    body = (
      <p className="text-ink-2">
        No dyno result yet. Record the pulls of a dyno day to see them against the target.
      </p>
    );
  } else {
    const { best, vsTarget } = sessions.data.summary;
    const pct = vsTarget.progressPct.value;
    body = (
      <div className="flex flex-col gap-2" data-testid="dyno-progress">
        <p className="text-3xl leading-tight font-bold tabular-nums text-ink">
          {progressText(pct, vsTarget.reached)}{' '}
          <span className="text-lg font-semibold text-ink-2">
            of {formatNumber(build.targetPowerHp, 1)} {build.targetPowerBasis} hp
          </span>
        </p>
        <ProgressBar pct={pct} label="Dyno progress toward the target" />
        <p className="text-ink-2">
          Best: {powerText(best.peakPowerHp, 'hp', best.basis)} on {formatIsoDate(best.date)} (
          {dynoKindShort[best.dynoKind].toLowerCase()}, {standardShortLabels[choice.standard]})
          {best.basis !== build.targetPowerBasis &&
            `, ${formatNumber(vsTarget.achieved.value, 1)} ${build.targetPowerBasis} hp with the ${formatNumber(sessions.data.plan.drivetrainLossPct, 1)} % drivetrain-loss assumption`}
          {vsTarget.reached
            ? ' — target reached.'
            : ` — ${formatNumber(vsTarget.remainingHp, 1)} ${build.targetPowerBasis} hp to go.`}
        </p>
      </div>
    );
  }
  return (
    <Section
      id="dyno-progress"
      title="Dyno progress"
      icon={<Activity aria-hidden className="size-5 text-accent-600" />}
      actions={
        <span className="flex items-center gap-2">
          {sessions.data?.summary.vsTarget?.reached && <Badge tone="ok">Reached</Badge>}
          {link}
        </span>
      }
    >
      {body}
    </Section>
  );
}
