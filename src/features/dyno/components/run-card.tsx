import { Download, FileUp, Paperclip, Pencil, Trash2 } from 'lucide-react';
import type { ReportRun } from '@shared/dyno';
import {
  boostUnitLabels,
  dynoAttachmentKindLabels,
  dynoTemperatureUnitLabels,
  type DynoRun,
} from '@shared/schemas/dyno';
import { formatNumber } from '@shared/format';
import { Badge } from '@/components/ui/badge';
import { Button, buttonClasses } from '@/components/ui/button';
import { cn } from '@/components/ui/cn';
import { getDynoCurveCsvHref } from '../api/export-dyno-curve';
import { factorText, powerText, rpmText, torqueText, weatherText } from '../format';
import { EngineFactorLine } from './correction-panel';
import { ShowWorking } from '@/components/ui/working';
import { WorkingBody } from './working';

export type RunActions = {
  onEdit?: () => void;
  onReplaceCurve?: () => void;
  onAttach?: () => void;
  onDelete?: () => void;
};

function Figure({ label, children }: { label: string; children: React.ReactNode }) {
  return (
    <div className="min-w-0">
      <dt className="text-xs font-semibold tracking-wide text-muted uppercase">{label}</dt>
      <dd className="font-semibold break-words text-ink tabular-nums">{children}</dd>
    </div>
  );
}

const kb = (bytes: number) =>
  bytes >= 1024 * 1024
    ? `${formatNumber(bytes / 1024 / 1024, 1)} MB`
    : `${formatNumber(Math.max(1, bytes / 1024), 0)} kB`;

/**
 * One pull: its corrected peaks under the chosen standard (the measured figures beside
 * them), the factor and its working, what else was logged, and what can be done with it.
 */
export function RunCard({
  run,
  report,
  best,
  colour,
  onChart,
  onToggleChart,
  buildId,
  actions,
}: {
  run: DynoRun;
  report: ReportRun;
  best: boolean;
  /** The run's colour on the chart, when it has a curve. */
  colour: string | null;
  onChart: boolean;
  onToggleChart: (on: boolean) => void;
  buildId: string;
  actions: RunActions;
}) {
  const c = report.corrected;
  const corrected = c.correction.standard !== 'uncorrected' && c.correction.applied;
  const basis = c.basis;
  const title = `Run ${run.runNumber}`;
  const details = [run.gear && `Gear ${run.gear}`, run.tuneRevision && `Tune ${run.tuneRevision}`]
    .filter(Boolean)
    .join(' · ');
  return (
    <article
      aria-label={title}
      className={cn(
        'flex flex-col gap-3 rounded-lg border bg-sheet px-4 py-3 sm:px-5',
        best ? 'border-accent-500 ring-1 ring-accent-100' : 'border-rule',
      )}
    >
      <header className="flex flex-wrap items-center gap-2">
        {colour && (
          <span aria-hidden className="size-3 rounded-full" style={{ background: colour }} />
        )}
        <h3 className="text-lg font-bold text-ink">{title}</h3>
        {best && <Badge tone="accent">Best run</Badge>}
        {run.status === 'aborted' ? (
          <Badge tone="tight">Stopped early</Badge>
        ) : (
          <Badge tone="neutral">Complete</Badge>
        )}
        {details && <span className="text-ink-2">{details}</span>}
      </header>
      {run.status === 'aborted' && run.abortReason && (
        <p className="text-[15px] text-ink-2">Why it was stopped: {run.abortReason}</p>
      )}
      <dl className="grid grid-cols-2 gap-x-6 gap-y-2 sm:grid-cols-3">
        <Figure label={corrected ? 'Peak power, corrected' : 'Peak power'}>
          {c.corrected.power != null && c.corrected.powerRpm != null ? (
            <>
              <span data-testid="run-peak-power">
                {powerText(c.corrected.power, c.powerUnit, basis)}
              </span>
              <span className="block text-sm font-normal text-ink-2">
                at {rpmText(c.corrected.powerRpm)}
              </span>
            </>
          ) : (
            '—'
          )}
        </Figure>
        <Figure label={corrected ? 'Peak torque, corrected' : 'Peak torque'}>
          {c.corrected.torque != null && c.corrected.torqueRpm != null ? (
            <>
              {torqueText(c.corrected.torque, c.torqueUnit)}
              <span className="block text-sm font-normal text-ink-2">
                at {rpmText(c.corrected.torqueRpm)}
              </span>
            </>
          ) : (
            '—'
          )}
        </Figure>
        <Figure label="Correction factor">
          {factorText(c.correction.factor)}
          {!c.correction.valid && (
            <Badge tone="over" className="ml-2">
              Outside range
            </Badge>
          )}
          {!c.correction.applied && (
            <span className="block text-sm font-normal text-ink-2">No weather: as measured</span>
          )}
        </Figure>
      </dl>
      {corrected && (
        <p className="text-sm text-muted">
          As measured:{' '}
          {c.measured.power != null ? powerText(c.measured.power, c.powerUnit, basis) : 'no power'}
          {c.measured.torque != null ? `, ${torqueText(c.measured.torque, c.torqueUnit)}` : ''}
          {c.measured.powerSource === 'curve' ? ' (peaks from the curve)' : ''}
        </p>
      )}
      {(run.boost != null || run.egt != null || run.mixture != null) && (
        <p className="text-[15px] text-ink-2">
          {[
            run.boost != null &&
              `Boost ${formatNumber(run.boost, 1)} ${boostUnitLabels[run.boostUnit]}`,
            run.egt != null &&
              `EGT ${formatNumber(run.egt, 0)} ${dynoTemperatureUnitLabels[run.egtUnit]}`,
            run.mixture != null &&
              (run.mixtureKind === 'afr'
                ? `AFR ${formatNumber(run.mixture, 1)}:1`
                : `λ ${formatNumber(run.mixture, 2)}`),
          ]
            .filter(Boolean)
            .join(' · ')}
        </p>
      )}
      {run.weather && <p className="text-sm text-ink-2">Own weather: {weatherText(run.weather)}</p>}
      {run.notes && <p className="text-[15px] whitespace-pre-line text-ink-2">{run.notes}</p>}
      <div className="flex flex-wrap items-center gap-x-4 gap-y-1 text-[15px]">
        {run.curve.length > 0 ? (
          <label className="flex min-h-11 items-center gap-2">
            <input
              type="checkbox"
              className="size-5"
              checked={onChart}
              onChange={(e) => onToggleChart(e.target.checked)}
            />
            On the chart ({formatNumber(run.curve.length, 0)} curve rows)
          </label>
        ) : (
          <span className="text-muted">No curve: peaks only</span>
        )}
        {run.attachment && (
          <a
            href={run.attachment.url}
            className="inline-flex min-h-11 items-center gap-1.5 font-semibold text-accent-700 underline"
          >
            <Paperclip aria-hidden className="size-4" />
            {run.attachment.name}
            <span className="font-normal text-muted">
              ({dynoAttachmentKindLabels[run.attachment.kind]}, {kb(run.attachment.bytes)})
            </span>
          </a>
        )}
      </div>
      <EngineFactorLine correction={c.correction} />
      <ShowWorking label={title}>
        <WorkingBody
          title={`Correction factor, ${c.correction.label}`}
          value={factorText(c.correction.factor)}
          working={c.correction.working}
        />
        {[c.peakPower, c.peakTorque]
          .filter((f) => f !== null)
          .map((f) => (
            <WorkingBody key={f.label} title={f.label} working={f.working} />
          ))}
      </ShowWorking>
      <div className="flex flex-wrap gap-2 border-t border-rule pt-3">
        {run.curve.length > 0 && (
          <a
            href={getDynoCurveCsvHref(buildId, run.id)}
            download
            className={buttonClasses('secondary', 'sm')}
          >
            <Download aria-hidden className="size-4" />
            Curve CSV (uncorrected)
          </a>
        )}
        {actions.onEdit && (
          <Button
            variant="secondary"
            size="sm"
            onClick={actions.onEdit}
            icon={<Pencil aria-hidden className="size-4" />}
          >
            Edit<span className="sr-only"> {title}</span>
          </Button>
        )}
        {actions.onReplaceCurve && (
          <Button
            variant="secondary"
            size="sm"
            onClick={actions.onReplaceCurve}
            icon={<FileUp aria-hidden className="size-4" />}
          >
            {run.curve.length ? 'Replace curve' : 'Add curve'}
            <span className="sr-only"> of {title}</span>
          </Button>
        )}
        {actions.onAttach && (
          <Button
            variant="secondary"
            size="sm"
            onClick={actions.onAttach}
            icon={<Paperclip aria-hidden className="size-4" />}
          >
            {run.attachment ? 'Replace file' : 'Attach file'}
            <span className="sr-only"> to {title}</span>
          </Button>
        )}
        {actions.onDelete && (
          <Button
            variant="ghost"
            size="sm"
            onClick={actions.onDelete}
            icon={<Trash2 aria-hidden className="size-4" />}
          >
            Delete<span className="sr-only"> {title}</span>
          </Button>
        )}
      </div>
    </article>
  );
}
