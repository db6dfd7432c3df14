import type { ReactNode } from 'react';
import type { EstimateResult } from '@shared/schemas/estimate';
import { partCategoryLabels } from '@shared/schemas/parts';
import { cn } from '@/components/ui/cn';
import { capitalise, categoryPhrase, formatFigure, formatHeadroom } from '../format';
import { StatusBadge } from './status-badge';
import { Working } from './working';

const statusText = {
  over: 'text-over',
  tight: 'text-tight',
  ok: 'text-ok',
} as const;

/**
 * The answer in one sentence: which part gives out first, its headroom at the target, and
 * the most power the rated parts support.
 */
export function EstimateSummary({ result }: { result: EstimateResult }) {
  const weakest = result.weakestLink;
  const part = weakest ? result.components.find((c) => c.id === weakest.componentId) : undefined;
  if (!weakest || !part || !result.supported) return null;
  const crankTarget = result.requirements.crankPower.value;
  const who = categoryPhrase(part.category) ?? part.name;
  const verb = part.status === 'over' ? 'gives out before the target' : 'gives out first';
  const qualifier = part.notes.some((n) => n.code === 'torque-curve-scaled')
    ? 'If the whole torque curve scales with power (the torque target sets the limit)'
    : undefined;

  return (
    <div className="flex flex-col gap-4">
      <div>
        <p className="text-sm font-semibold tracking-wide text-muted uppercase">Weakest link</p>
        <p
          className="mt-1 text-2xl leading-snug font-bold text-ink sm:text-[1.7rem]"
          data-testid="weakest-link"
        >
          {capitalise(who)} {verb}:{' '}
          <span className={cn('tabular-nums', statusText[part.status])}>
            {formatHeadroom(part.headroomPct.value)} headroom
          </span>{' '}
          at {formatFigure(crankTarget, 'hp-crank')}
        </p>
        <p className="mt-1.5 flex flex-wrap items-center gap-x-2 gap-y-1 text-ink-2">
          <StatusBadge status={part.status} />
          <span>
            {part.name}
            {part.name.toLowerCase().includes(partCategoryLabels[part.category].toLowerCase())
              ? ''
              : ` (${partCategoryLabels[part.category]})`}
            : rated {formatFigure(part.capacity.value, part.capacity.unit)}, needs{' '}
            {formatFigure(part.requirement.value, part.requirement.unit)}.
          </span>
        </p>
      </div>
      <div className="grid gap-3 sm:grid-cols-2">
        <SupportedFigure
          title="Most crank power the build supports"
          value={formatFigure(result.supported.crankPower.value, 'hp-crank')}
          qualifier={qualifier}
          working={<Working figures={[result.supported.crankPower]} />}
        />
        <SupportedFigure
          title="Most wheel power the build supports"
          value={formatFigure(result.supported.wheelPower.value, 'hp-wheel')}
          qualifier={qualifier}
          working={<Working figures={[result.supported.wheelPower]} />}
        />
      </div>
      {result.unknownCategories.length > 0 && (
        <p className="text-[15px] text-muted">
          Limited by the rated parts only: {result.unknownCategories.length} categor
          {result.unknownCategories.length === 1 ? 'y has' : 'ies have'} no rating and could give
          out sooner (listed under the parts).
        </p>
      )}
    </div>
  );
}

function SupportedFigure({
  title,
  value,
  qualifier,
  working,
}: {
  title: string;
  value: string;
  /** When the figure holds only under a stated condition. */
  qualifier?: string;
  working: ReactNode;
}) {
  return (
    <div className="rounded-md border border-rule bg-paper/50 px-3.5 pt-2.5 pb-1">
      <p className="text-sm font-semibold tracking-wide text-muted uppercase">{title}</p>
      <p className="text-3xl leading-tight font-bold tabular-nums text-ink">{value}</p>
      {qualifier && <p className="text-sm text-muted">{qualifier}</p>}
      {working}
    </div>
  );
}

/** The what-if's answer in one line, shown beside the slider so a phone sees it while sliding. */
export function PreviewAnswer({ result }: { result: EstimateResult }) {
  const weakest = result.weakestLink;
  const part = weakest ? result.components.find((c) => c.id === weakest.componentId) : undefined;
  if (!part || !result.supported) {
    return <p className="text-ink-2">No rated parts: nothing to check the what-if against.</p>;
  }
  const who = capitalise(categoryPhrase(part.category) ?? part.name);
  return (
    <p
      className="flex flex-wrap items-center gap-x-2 gap-y-1 text-ink"
      data-testid="preview-answer"
    >
      <StatusBadge status={part.status} />
      <span>
        <strong>{who}</strong>{' '}
        {part.status === 'over' ? 'gives out before the target' : 'gives out first'}:{' '}
        <strong className={cn('tabular-nums', statusText[part.status])}>
          {formatHeadroom(part.headroomPct.value)}
        </strong>{' '}
        headroom. The parts support about{' '}
        <strong className="tabular-nums">
          {formatFigure(result.supported.crankPower.value, 'hp-crank')}
        </strong>
        .
      </span>
    </p>
  );
}
