import type { ReactNode } from 'react';
import { Link } from 'react-router-dom';
import { ExternalLink, Info } from 'lucide-react';
import type { ComponentResult, EstimateResult } from '@shared/schemas/estimate';
import { partCategoryLabels, ratingUnitLabels } from '@shared/schemas/parts';
import { cn } from '@/components/ui/cn';
import { paths } from '@/config/paths';
import { formatFigure, formatHeadroom } from '../format';
import { StatusBadge } from './status-badge';
import { Working } from './working';

const edge = { over: 'border-l-over', tight: 'border-l-tight', ok: 'border-l-ok' } as const;

/** Each rated part against what the target asks of it, least headroom first. */
export function PartsHeadroom({
  result,
  buildId,
  canEditRatings,
}: {
  result: EstimateResult;
  buildId: string;
  canEditRatings: boolean;
}) {
  const parts = [...result.components].sort((a, b) => a.headroomPct.value - b.headroomPct.value);
  return (
    <ul className="flex flex-col gap-3">
      {parts.map((part) => (
        <PartRow
          key={part.id}
          part={part}
          buildId={buildId}
          canEditRatings={canEditRatings}
          weakest={part.id === result.weakestLink?.componentId}
        />
      ))}
    </ul>
  );
}

function PartRow({
  part,
  buildId,
  canEditRatings,
  weakest,
}: {
  part: ComponentResult;
  buildId: string;
  canEditRatings: boolean;
  weakest: boolean;
}) {
  const scaled = part.notes.some((n) => n.code === 'torque-curve-scaled');
  const perUnit = part.quantityMultiplies
    ? ` (${part.quantity} × ${formatFigure(part.ratingValue, part.ratingUnit)} in parallel)`
    : '';
  return (
    <li
      className={cn(
        'rounded-md border border-l-4 border-rule bg-sheet px-3.5 py-3 sm:px-4',
        edge[part.status],
      )}
    >
      <div className="flex flex-wrap items-start justify-between gap-x-3 gap-y-1">
        <div className="min-w-0">
          <h3 className="font-bold break-words text-ink">{part.name}</h3>
          <p className="text-sm text-muted">
            {partCategoryLabels[part.category]}
            {part.ratingFor ? ` · rated for ${part.ratingFor}` : ''}
          </p>
        </div>
        <div className="flex flex-wrap items-center gap-1.5">
          {weakest && (
            <span className="rounded bg-ink px-2 py-0.5 text-sm font-semibold text-white">
              Weakest link
            </span>
          )}
          <StatusBadge status={part.status} />
        </div>
      </div>
      <dl className="mt-2 grid grid-cols-2 gap-x-4 gap-y-2 sm:grid-cols-4">
        <Stat term="Rated">
          {formatFigure(part.capacity.value, part.capacity.unit)}
          {perUnit && <span className="block text-sm font-normal text-muted">{perUnit}</span>}
        </Stat>
        <Stat term="Target needs">
          {formatFigure(part.requirement.value, part.requirement.unit)}
        </Stat>
        <Stat term="Headroom">{formatHeadroom(part.headroomPct.value)}</Stat>
        <Stat term="Supports about">
          {formatFigure(part.supportedCrankPower.value, 'hp-crank')}
          {scaled && (
            <span className="block text-sm font-normal text-muted">
              if the whole torque curve scales
            </span>
          )}
        </Stat>
      </dl>
      {part.notes.length > 0 && (
        <ul className="mt-2 flex flex-col gap-1" aria-label={`Notes on ${part.name}`}>
          {part.notes.map((note) => (
            <li
              key={note.code}
              className="flex gap-2 text-[15px] text-ink-2"
              data-testid={`note-${note.code}`}
            >
              <Info aria-hidden className="mt-0.5 size-4 shrink-0 text-ink-3" />
              <span>{note.message}</span>
            </li>
          ))}
        </ul>
      )}
      <div className="mt-1 flex flex-wrap items-start gap-x-6">
        <Working
          className="open:basis-full"
          label={part.name}
          figures={[part.capacity, part.requirement, part.headroomPct, part.supportedCrankPower]}
        />
        {part.anonymised ? (
          // Not sent to this shop: its ledger does not hold the part, so there is nothing to open.
          <p className="inline-flex min-h-11 items-center text-[15px] text-muted">
            Not sent to your shop: shown by category only
          </p>
        ) : (
          <Link
            to={paths.builds.part.getHref(buildId, part.id)}
            className="inline-flex min-h-11 items-center gap-1.5 rounded text-[15px] font-semibold text-accent-700 hover:underline"
          >
            <ExternalLink aria-hidden className="size-4" />
            {canEditRatings
              ? 'Change its rating in the parts ledger'
              : 'See it in the parts ledger'}
            <span className="sr-only">
              {' '}
              ({part.name}, rated in {ratingUnitLabels[part.ratingUnit]})
            </span>
          </Link>
        )}
      </div>
    </li>
  );
}

function Stat({ term, children }: { term: string; children: ReactNode }) {
  return (
    <div className="min-w-0">
      <dt className="text-sm font-semibold tracking-wide text-muted uppercase">{term}</dt>
      <dd className="font-semibold tabular-nums text-ink">{children}</dd>
    </div>
  );
}

/** Categories with no rated part: their capacity is unknown, which is not the same as fine. */
export function UnknownCategories({ result }: { result: EstimateResult }) {
  if (result.unknownCategories.length === 0) return null;
  return (
    <div className="rounded-md border border-dashed border-rule-strong px-3.5 py-3">
      <p className="font-semibold text-ink">Not rated — unknown</p>
      <p className="text-[15px] text-muted">
        No part in these categories has a rating, so the estimate cannot say whether they hold the
        target. They are not counted as fine.
      </p>
      <ul className="mt-2 flex flex-wrap gap-1.5">
        {result.unknownCategories.map((c) => (
          <li
            key={c}
            className="rounded border border-rule-strong bg-sheet px-2 py-0.5 text-sm font-semibold text-ink-2"
          >
            {partCategoryLabels[c]}: unknown
          </li>
        ))}
      </ul>
    </div>
  );
}
