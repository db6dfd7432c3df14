import { memo } from 'react';
import { partCategoryLabels, type Part } from '@shared/schemas/parts';
import { cn } from '@/components/ui/cn';
import { cachedDate, cachedMoney } from '../lib/format-cache';
import { StatusBadge } from './status-badge';
import { StatusSelect } from './status-select';
import { RatingText, RowActions, useLedgerActions, type MoneyView } from './parts-columns';
import { partElementId } from '../lib/part-element-id';

function Fact({ term, children }: { term: string; children: React.ReactNode }) {
  return (
    <div className="min-w-0">
      <dt className="text-xs font-semibold tracking-wide text-muted uppercase">{term}</dt>
      <dd className="break-words text-ink">{children}</dd>
    </div>
  );
}

/**
 * One part in the phone list: the facts a person in the garage needs, status changeable.
 * Its name is an h3 under a category's h2 when the list is grouped, an h2 when it is not.
 */
export const PartCard = memo(function PartCard({
  part,
  money,
  headingLevel,
  picked = false,
}: {
  part: Part;
  money: MoneyView;
  headingLevel: 2 | 3;
  /** Picked out by a link (from the estimate): marked, and focusable to be scrolled to. */
  picked?: boolean;
}) {
  const Heading = headingLevel === 2 ? 'h2' : 'h3';
  const { currency, onStatusChange } = useLedgerActions();
  const sub = [partCategoryLabels[part.category], part.vendor, part.partNumber]
    .filter(Boolean)
    .join(' · ');
  const date =
    part.status === 'installed' && part.installedOn
      ? { term: 'Installed', value: part.installedOn }
      : part.status === 'at-shop' && part.sendOut?.dueOn
        ? { term: 'Due back', value: part.sendOut.dueOn }
        : part.expectedOn && (part.status === 'planned' || part.status === 'ordered')
          ? { term: 'Expected', value: part.expectedOn }
          : part.receivedOn
            ? { term: 'Received', value: part.receivedOn }
            : null;
  // A returned part is set apart by a dashed edge on paper, its badge and its struck-out total;
  // not by fading the card, which took its grey text below AA contrast (3.5:1 for 4.5:1).
  return (
    <li
      id={partElementId(part.id)}
      tabIndex={picked ? -1 : undefined}
      aria-current={picked ? 'true' : undefined}
      className={cn(
        'rounded-lg border p-3',
        part.status === 'returned'
          ? 'border-dashed border-rule-strong bg-paper'
          : 'border-rule bg-sheet shadow-[0_1px_0_rgba(27,34,48,0.04)]',
        picked && 'border-accent-600 bg-accent-50 outline-2 outline-accent-600',
      )}
    >
      <div className="flex items-start justify-between gap-2">
        <div className="min-w-0 pt-1">
          <Heading className="text-base leading-snug font-bold break-words text-ink">
            {part.name}
          </Heading>
          {sub && <p className="text-sm break-words text-muted">{sub}</p>}
        </div>
        <RowActions part={part} className="-mt-1 -mr-1 shrink-0" />
      </div>
      <div className="mt-2">
        {onStatusChange ? (
          <StatusSelect part={part} onChange={onStatusChange} />
        ) : (
          <StatusBadge status={part.status} />
        )}
        {part.status === 'at-shop' && part.shopName && (
          <p className="mt-1 text-sm text-muted">with {part.shopName}</p>
        )}
      </div>
      <dl className="mt-3 grid grid-cols-2 gap-x-4 gap-y-2 text-[15px]">
        <Fact term="Quantity">{part.quantity}</Fact>
        {date && (
          <Fact term={date.term}>
            <time dateTime={date.value}>{cachedDate(date.value)}</time>
          </Fact>
        )}
        {part.ratingValue != null && (
          <Fact term="Rating">
            <RatingText part={part} />
          </Fact>
        )}
        {money === 'full' && part.totalCents !== undefined && (
          <Fact term="Total">
            <span
              className={cn('font-bold tabular-nums', part.status === 'returned' && 'line-through')}
            >
              {cachedMoney(part.totalCents, currency)}
            </span>
          </Fact>
        )}
        {money === 'quote' && part.labourCents !== undefined && (
          <Fact term="Your quote">
            <span className="font-bold tabular-nums">
              {cachedMoney(part.labourCents, currency)}
            </span>
          </Fact>
        )}
      </dl>
    </li>
  );
});
