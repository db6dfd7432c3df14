import { memo } from 'react';
import { ChevronDown, ChevronRight } from 'lucide-react';
import { partCategoryLabels, type PartCategory } from '@shared/schemas/parts';
import { cachedMoney } from '../lib/format-cache';
import type { MoneyView, PartRow } from './parts-columns';

/* The ledger grouped by category: a heading per category that opens and closes it, with its subtotal. */

function groupLabel(row: PartRow): string {
  return partCategoryLabels[row.groupingValue as PartCategory] ?? String(row.groupingValue);
}

function ToggleGroup({
  row,
  isExpanded,
  listed,
}: {
  row: PartRow;
  isExpanded: boolean;
  /** Set when the list stops inside this category: how many of its parts are listed. */
  listed?: number;
}) {
  const label = groupLabel(row);
  const count = row.subRows.length;
  return (
    <button
      type="button"
      aria-expanded={isExpanded}
      onClick={() => row.toggleExpanded()}
      className="inline-flex min-h-11 items-center gap-2 rounded pr-2 text-left font-bold text-ink hover:text-accent-700"
    >
      {isExpanded ? (
        <ChevronDown aria-hidden className="size-5 shrink-0" />
      ) : (
        <ChevronRight aria-hidden className="size-5 shrink-0" />
      )}
      <span>{label}</span>
      <span className="font-normal text-muted">
        {count} {count === 1 ? 'part' : 'parts'}
        {listed !== undefined && `, ${listed} listed`}
      </span>
    </button>
  );
}

/** A category heading inside the table, with its subtotal under the Total column. */
export const GroupRow = memo(function GroupRow({
  row,
  money,
  currency,
  isExpanded,
  listed,
}: {
  row: PartRow;
  visibleKey: string;
  money: MoneyView;
  currency: string;
  isExpanded: boolean;
  listed?: number;
}) {
  const cells = row.getVisibleCells();
  const totalIndex = cells.findIndex((c) => c.column.id === 'totalCents');
  const subtotal =
    money === 'full' ? cachedMoney(Number(row.getValue('totalCents') ?? 0), currency) : null;
  const label = groupLabel(row);
  return (
    <tr className="border-b border-rule bg-paper">
      {totalIndex > 0 ? (
        <>
          <th scope="rowgroup" colSpan={totalIndex} className="px-3 py-0 text-left">
            <span className="sticky left-3 inline-block">
              <ToggleGroup row={row} isExpanded={isExpanded} listed={listed} />
            </span>
          </th>
          <td className="px-3 py-1 text-right font-bold whitespace-nowrap tabular-nums">
            <span className="sr-only">Subtotal for {label}: </span>
            {subtotal}
          </td>
          {cells.length - totalIndex - 1 > 0 && <td colSpan={cells.length - totalIndex - 1} />}
        </>
      ) : (
        <th scope="rowgroup" colSpan={cells.length} className="px-3 py-0 text-left">
          <span className="sticky left-3 inline-flex flex-wrap items-center gap-x-4">
            <ToggleGroup row={row} isExpanded={isExpanded} listed={listed} />
            {subtotal && (
              <span className="font-bold tabular-nums">
                <span className="font-normal text-muted">Subtotal </span>
                {subtotal}
              </span>
            )}
          </span>
        </th>
      )}
    </tr>
  );
});

/** A category heading in the phone list: an h2 under the page's h1, its parts' h3s under it. */
export function GroupHeading({
  row,
  money,
  currency,
  isExpanded,
  listed,
}: {
  row: PartRow;
  money: MoneyView;
  currency: string;
  isExpanded: boolean;
  listed?: number;
}) {
  return (
    <li className="mt-2 flex flex-wrap items-center justify-between gap-x-3 border-b-2 border-rule-strong first:mt-0">
      <h2 className="m-0 text-base">
        <ToggleGroup row={row} isExpanded={isExpanded} listed={listed} />
      </h2>
      {money === 'full' && (
        <p className="font-bold tabular-nums">
          <span className="font-normal text-muted">Subtotal </span>
          {cachedMoney(Number(row.getValue('totalCents') ?? 0), currency)}
        </p>
      )}
    </li>
  );
}
