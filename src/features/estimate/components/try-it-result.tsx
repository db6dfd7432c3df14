import type { EstimateResult } from '@shared/schemas/estimate';
import { partCategoryLabels } from '@shared/schemas/parts';
import { paths } from '@/config/paths';
import { ButtonLink } from '@/components/ui/button';
import {
  capitalise,
  categoryPhrase,
  formatFigure,
  formatHeadroom,
  formatShortfall,
} from '../format';
import { StatusBadge } from './status-badge';
import { partFields } from './try-it-request';

/** The calculator's answer: the weakest link, what the rated parts support, each part's headroom. */
export function TryItResult({ result }: { result: EstimateResult }) {
  const weakest = result.weakestLink;
  const part = weakest ? result.components.find((c) => c.id === weakest.componentId) : undefined;
  const bottomEnd = result.warnings.find((w) => w.code === 'target-exceeds-bottom-end');
  return (
    <div className="flex flex-col gap-3">
      {bottomEnd?.shortfall && (
        <div
          role="alert"
          className="rounded-md border-2 border-over bg-over-soft px-3.5 py-3 text-[#7d1f17]"
        >
          <p className="font-bold">
            The target is past the bottom-end rating by {formatShortfall(bottomEnd.shortfall)}.
          </p>
        </div>
      )}
      {part && result.supported ? (
        <div className="rounded-md border border-rule bg-paper/60 px-4 py-3">
          <p className="text-sm font-semibold tracking-wide text-muted uppercase">Weakest link</p>
          <p className="text-xl leading-snug font-bold text-ink">
            {capitalise(categoryPhrase(part.category) ?? part.name)}{' '}
            {part.status === 'over' ? 'gives out before the target' : 'gives out first'}:{' '}
            {formatHeadroom(part.headroomPct.value)} headroom at{' '}
            {formatFigure(result.requirements.crankPower.value, 'hp-crank')}
          </p>
          <p className="mt-2 text-ink-2">
            The parts you rated support about{' '}
            <strong className="text-ink">
              {formatFigure(result.supported.crankPower.value, 'hp-crank')}
            </strong>{' '}
            ({formatFigure(result.supported.wheelPower.value, 'hp-wheel')}).
          </p>
        </div>
      ) : (
        <p className="rounded-md border border-dashed border-rule-strong px-4 py-4 text-muted">
          Enter at least one rating to find the weakest link.
        </p>
      )}
      <ul className="flex flex-col divide-y divide-rule rounded-md border border-rule">
        {partFields.map((p) => {
          const c = result.components.find((r) => r.id === p.key);
          return (
            <li key={p.key} className="flex flex-wrap items-center justify-between gap-2 px-3 py-2">
              <span className="min-w-0">
                <span className="font-semibold text-ink">{partCategoryLabels[p.category]}</span>
                {c && (
                  <span className="block text-sm text-ink-2 tabular-nums">
                    rated {formatFigure(c.capacity.value, c.capacity.unit)}, needs{' '}
                    {formatFigure(c.requirement.value, c.requirement.unit)} (
                    {formatHeadroom(c.headroomPct.value)})
                  </span>
                )}
              </span>
              <StatusBadge status={c ? c.status : 'unknown'} />
            </li>
          );
        })}
      </ul>
      <ButtonLink to={paths.auth.signUp.getHref()} variant="secondary" className="self-start">
        Keep a whole build’s ratings: create an account
      </ButtonLink>
    </div>
  );
}
