import { memo } from 'react';
import { FlexRender } from '@tanstack/react-table';
import { ArrowDown, ArrowUp, ArrowUpDown } from 'lucide-react';
import type { SortingState } from '@tanstack/react-table';
import { cn } from '@/components/ui/cn';
import { partElementId } from '../lib/part-element-id';
import type { pageRows } from '../lib/page-rows';
import { GroupRow } from './ledger-groups';
import type { ColumnMeta, MoneyView, PartRow } from './parts-columns';
import type { useLedgerTable } from './use-ledger-table';

/** The ledger as a table (768 px and wider): sortable headings, category rows, part rows. */
export function LedgerTable({
  table,
  rows,
  page,
  sorting,
  visibleKey,
  money,
  currency,
  focusPartId,
}: {
  table: ReturnType<typeof useLedgerTable>['table'];
  rows: PartRow[];
  page: ReturnType<typeof pageRows<PartRow>>;
  sorting: SortingState;
  visibleKey: string;
  money: MoneyView;
  currency: string;
  focusPartId: string | null;
}) {
  return (
    <div className="overflow-x-auto rounded-lg border border-rule bg-sheet">
      <table className="w-full border-collapse text-left text-[15px]">
        <caption className="sr-only">
          Parts ledger{sorting[0] ? `, sorted by ${sorting[0].id}` : ''}
        </caption>
        <thead>
          {table.getHeaderGroups().map((group) => (
            <tr key={group.id} className="border-b border-rule-strong bg-paper/70">
              {group.headers.map((header) => {
                const meta = header.column.columnDef.meta as ColumnMeta | undefined;
                const sorted = header.column.getIsSorted();
                const canSort = header.column.getCanSort();
                return (
                  <th
                    key={header.id}
                    scope="col"
                    aria-sort={
                      sorted === 'asc' ? 'ascending' : sorted === 'desc' ? 'descending' : undefined
                    }
                    className={cn(
                      'px-3 py-1 text-sm font-semibold whitespace-nowrap text-ink-2',
                      meta?.align === 'right' && 'text-right',
                      header.column.id === 'name' &&
                        'sticky left-0 z-10 min-w-56 bg-paper shadow-[1px_0_0_var(--color-rule)]',
                    )}
                  >
                    {canSort ? (
                      <button
                        type="button"
                        onClick={header.column.getToggleSortingHandler()}
                        className={cn(
                          'inline-flex min-h-11 items-center gap-1 rounded px-1 -mx-1 hover:text-ink',
                          meta?.align === 'right' && 'flex-row-reverse',
                          sorted && 'text-ink',
                        )}
                      >
                        <FlexRender header={header} />
                        {sorted === 'asc' ? (
                          <ArrowUp aria-hidden className="size-4 text-accent-600" />
                        ) : sorted === 'desc' ? (
                          <ArrowDown aria-hidden className="size-4 text-accent-600" />
                        ) : (
                          <ArrowUpDown aria-hidden className="size-3.5 opacity-40" />
                        )}
                      </button>
                    ) : (
                      <FlexRender header={header} />
                    )}
                  </th>
                );
              })}
            </tr>
          ))}
        </thead>
        <tbody>
          {rows.map((row) =>
            row.getIsGrouped() ? (
              <GroupRow
                key={row.id}
                row={row}
                visibleKey={visibleKey}
                money={money}
                currency={currency}
                isExpanded={row.getIsExpanded()}
                listed={page.cut?.header === row ? page.cut.listed : undefined}
              />
            ) : (
              <LeafRow
                key={row.id}
                row={row}
                visibleKey={visibleKey}
                picked={row.id === focusPartId}
              />
            ),
          )}
        </tbody>
      </table>
    </div>
  );
}

/** One part as a table row. Memoised on the row object and the set of visible columns. */
const LeafRow = memo(function LeafRow({
  row,
  picked,
}: {
  row: PartRow;
  visibleKey: string;
  picked: boolean;
}) {
  return (
    <tr
      id={partElementId(row.id)}
      tabIndex={picked ? -1 : undefined}
      aria-current={picked ? 'true' : undefined}
      className={cn(
        'group border-b border-rule last:border-b-0 hover:bg-paper/60',
        row.original.status === 'returned' && 'text-muted',
        picked && 'bg-accent-50 outline-2 -outline-offset-2 outline-accent-600',
      )}
    >
      {row.getVisibleCells().map((cell) => {
        const meta = cell.column.columnDef.meta as ColumnMeta | undefined;
        const isName = cell.column.id === 'name';
        const content = <FlexRender cell={cell} />;
        return isName ? (
          <th
            key={cell.id}
            scope="row"
            className={cn(
              'sticky left-0 z-[1] max-w-80 min-w-56 bg-sheet px-3 py-2 text-left font-normal shadow-[1px_0_0_var(--color-rule)] group-hover:bg-[#fbf8f1]',
              // The sticky cell covers the row's outline: it carries the mark itself.
              picked &&
                'bg-accent-50 shadow-[inset_4px_0_0_var(--color-accent-600),1px_0_0_var(--color-rule)] group-hover:bg-accent-50',
            )}
          >
            {content}
          </th>
        ) : (
          <td
            key={cell.id}
            className={cn(
              'px-3 py-2 align-middle',
              meta?.align === 'right' && 'text-right',
              cell.column.id === 'actions' && 'w-0 py-0 pr-1',
            )}
          >
            {content}
          </td>
        );
      })}
    </tr>
  );
});
