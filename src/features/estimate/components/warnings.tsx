import { CircleAlert, Info, OctagonAlert, TriangleAlert } from 'lucide-react';
import type { EstimateResult, EstimateWarning } from '@shared/schemas/estimate';
import { cn } from '@/components/ui/cn';
import { formatFigure, formatShortfall } from '../format';

/**
 * The target past a bottom-end rating: the one finding nobody may miss. A banner at the top,
 * announced at once (role="alert"), with the shortfall in the part's unit and in crank hp.
 */
export function BottomEndBanner({
  result,
  preview,
}: {
  result: EstimateResult;
  /** The what-if target in words ("700 wheel hp") when the figures are a preview, not the saved target. */
  preview: string | null;
}) {
  const warnings = result.warnings.filter((w) => w.code === 'target-exceeds-bottom-end');
  if (warnings.length === 0) return null;
  return (
    <div className="flex flex-col gap-3">
      {warnings.map((w) => {
        const part = result.components.find((c) => c.id === w.componentId);
        return (
          <div
            key={w.componentId ?? w.message}
            role="alert"
            className="flex gap-3 rounded-lg border-2 border-over bg-over-soft px-4 py-4 text-[#7d1f17] shadow-sm sm:px-5"
          >
            <OctagonAlert aria-hidden className="mt-0.5 size-7 shrink-0 text-over" />
            <div className="min-w-0">
              <p className="text-xl leading-snug font-bold">
                {preview
                  ? `At the what-if target of ${preview}, the bottom end is past its rating`
                  : 'The target is past the bottom-end rating'}
                {w.shortfall && <> by {formatShortfall(w.shortfall)}</>}
              </p>
              {part && w.shortfall && (
                <p className="mt-1 text-base">
                  {part.name}: rated {formatFigure(part.capacity.value, part.capacity.unit)}; the
                  target needs {formatFigure(part.requirement.value, part.requirement.unit)}. It
                  supports about{' '}
                  <strong>{formatFigure(part.supportedCrankPower.value, 'hp-crank')}</strong>
                  {part.notes.some((n) => n.code === 'torque-curve-scaled')
                    ? ' if the whole torque curve scales with power'
                    : ''}
                  , {formatFigure(w.shortfall.crankHp, 'hp-crank')} short of the target. Lower the
                  target or build the bottom end for more before adding power.
                </p>
              )}
              {!part && <p className="mt-1 text-base">{w.message}</p>}
            </div>
          </div>
        );
      })}
    </div>
  );
}

const severityStyle: Record<
  EstimateWarning['severity'],
  { icon: typeof Info; box: string; iconClass: string }
> = {
  danger: {
    icon: CircleAlert,
    box: 'border-over/40 bg-over-soft text-[#7d1f17]',
    iconClass: 'text-over',
  },
  warning: {
    icon: TriangleAlert,
    box: 'border-tight/40 bg-tight-soft text-[#6b4408]',
    iconClass: 'text-tight',
  },
  info: {
    icon: Info,
    box: 'border-rule-strong bg-sheet text-ink-2',
    iconClass: 'text-ink-3',
  },
};

/** Every warning the estimate raised, most serious first (the estimator already orders them). */
export function WarningsList({ warnings }: { warnings: EstimateWarning[] }) {
  if (warnings.length === 0) {
    return (
      <p className="text-ink-2">
        No warnings: every rated part clears the target by more than the “tight” margin. That is not
        a guarantee (see the note on estimates).
      </p>
    );
  }
  return (
    <ul className="flex flex-col gap-2">
      {warnings.map((w, i) => {
        const style = severityStyle[w.severity];
        const Icon = style.icon;
        return (
          <li
            key={`${w.code}-${w.componentId ?? i}`}
            className={cn('flex gap-2.5 rounded-md border px-3.5 py-2.5', style.box)}
          >
            <Icon aria-hidden className={cn('mt-0.5 size-5 shrink-0', style.iconClass)} />
            <p className="min-w-0">{w.message}</p>
          </li>
        );
      })}
    </ul>
  );
}
