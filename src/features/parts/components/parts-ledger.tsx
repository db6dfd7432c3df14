import {
  memo,
  useCallback,
  useDeferredValue,
  useEffect,
  useMemo,
  useState,
  type ReactNode,
} from 'react';
import {
  FlexRender,
  useTable,
  type ColumnFiltersState,
  type ColumnVisibilityState,
  type ExpandedState,
  type SortingState,
} from '@tanstack/react-table';
import { ArrowDown, ArrowUp, ArrowUpDown, ChevronDown, ChevronRight, SearchX } from 'lucide-react';
import {
  partCategories,
  partCategoryLabels,
  partStatuses,
  partStatusLabels,
  type Part,
  type PartCategory,
  type PartStatus,
} from '../../../../shared/schemas/parts';
import { Button } from '../../../components/ui/button';
import { cn } from '../../../components/ui/cn';
import { cachedMoney } from '../lib/format-cache';
import { EmptyState } from '../../../components/ui/states';
import {
  loadColumnVisibility,
  loadGrouped,
  saveColumnVisibility,
  saveGrouped,
} from '../lib/column-prefs';
import { useMediaQuery } from '../lib/use-media-query';
import { pageRows } from '../lib/page-rows';
import { partElementId } from '../lib/part-element-id';
import { ColumnChooser } from './column-chooser';
import { PartCard } from './part-card';
import {
  LedgerActionsContext,
  buildPartColumns,
  defaultColumnVisibility,
  moneyViewOf,
  partSearchFilter,
  partsFeatures,
  type ColumnMeta,
  type LedgerActions,
  type MoneyView,
  type PartRow,
} from './parts-columns';
import { LedgerToolbar, type LedgerFilters } from './ledger-toolbar';

/** Rows listed at first, and added by each "Show more". */
const rowsPerStep = 40;

const categoryRank = Object.fromEntries(partCategories.map((c, i) => [c, i]));

/** Parts in the product's category order (the order groups appear in), then as the API sent them. */
function inCategoryOrder(parts: Part[]): Part[] {
  return parts
    .map((p, i) => ({ p, i }))
    .sort((a, b) => categoryRank[a.p.category] - categoryRank[b.p.category] || a.i - b.i)
    .map(({ p }) => p);
}

function liveTotalOf(rows: readonly PartRow[]): number {
  let sum = 0;
  for (const row of rows) {
    const p = row.original;
    if (p.status !== 'returned') sum += p.totalCents ?? 0;
  }
  return sum;
}

export type PartsLedgerProps = {
  parts: Part[];
  actions: LedgerActions;
  /** Money the role receives when the list is empty (with parts, the parts themselves say). */
  moneyFallback?: MoneyView;
  initialSearch?: string;
  /** Buttons beside the filters: add, import, export. */
  toolbarActions?: ReactNode;
  /** Force a layout (the benchmark); by default a table from 768 px, cards below. */
  layout?: 'auto' | 'table' | 'cards';
  /** A part to pick out (a link from the estimate): listed, its category open, scrolled to. */
  focusPartId?: string | null;
};

/**
 * The parts ledger: filters, then a sortable table (cards on a phone) grouped by category
 * with subtotals for roles that see money. Rows are memoised, so sorting and filtering only
 * move or drop rows that already exist instead of rendering every one again.
 */
export function PartsLedger({
  parts,
  actions,
  moneyFallback = 'none',
  initialSearch = '',
  toolbarActions,
  layout = 'auto',
  focusPartId = null,
}: PartsLedgerProps) {
  const wideScreen = useMediaQuery('(min-width: 768px)');
  const wide = layout === 'auto' ? wideScreen : layout === 'table';

  const money = moneyViewOf(parts, moneyFallback);
  const columns = useMemo(() => buildPartColumns(money), [money]);
  const data = useMemo(() => inCategoryOrder(parts), [parts]);

  const [search, setSearch] = useState(initialSearch);
  // The box shows every key at once; the list follows a moment later if it is large.
  const deferredSearch = useDeferredValue(search);
  const [filters, setFilters] = useState<LedgerFilters>({ category: '', status: '' });
  const [sorting, setSorting] = useState<SortingState>([]);
  const [grouped, setGrouped] = useState(() => loadGrouped(true));
  const [expanded, setExpanded] = useState<ExpandedState>(true);
  const [limit, setLimit] = useState(rowsPerStep);
  const [columnVisibility, setColumnVisibility] = useState<ColumnVisibilityState>(() =>
    loadColumnVisibility(defaultColumnVisibility),
  );

  useEffect(() => saveColumnVisibility(columnVisibility), [columnVisibility]);
  useEffect(() => saveGrouped(grouped), [grouped]);

  const columnFilters = useMemo<ColumnFiltersState>(() => {
    const list: ColumnFiltersState = [];
    if (filters.category) list.push({ id: 'category', value: filters.category });
    if (filters.status) list.push({ id: 'status', value: filters.status });
    return list;
  }, [filters]);
  const grouping = useMemo(() => (grouped ? ['category'] : []), [grouped]);
  // A group heading already names the category, so its column steps aside while grouped.
  const shownColumns = useMemo(
    () => (grouped ? { ...columnVisibility, category: false } : columnVisibility),
    [grouped, columnVisibility],
  );

  const table = useTable({
    features: partsFeatures,
    columns,
    data,
    getRowId: (p) => p.id,
    state: {
      sorting,
      columnFilters,
      globalFilter: deferredSearch,
      grouping,
      expanded,
      columnVisibility: shownColumns,
    },
    onSortingChange: setSorting,
    onExpandedChange: setExpanded,
    onColumnVisibilityChange: (updater) =>
      setColumnVisibility((old) => {
        const next = typeof updater === 'function' ? updater(old) : updater;
        // "category" is hidden only for display while grouped; keep the user's own choice.
        return grouped ? { ...next, category: old.category ?? true } : next;
      }),
    globalFilterFn: partSearchFilter,
    getColumnCanGlobalFilter: (column) => column.id === 'name',
    autoResetExpanded: false,
    enableSortingRemoval: true,
  });

  const filteredRows = table.getFilteredRowModel().rows;
  const allRows = table.getRowModel().rows;
  // The browser lays out only what is listed: a few hundred rows of form controls cost far
  // more to lay out and paint than to sort, so the list grows on request, by parts (category
  // headers are not counted, and never listed without a part of theirs).
  const page = pageRows(allRows, limit, (r) => r.getIsGrouped());
  const rows = page.rows;
  const hiddenParts = page.listable - page.listed;
  const inClosedCategories = filteredRows.length - page.listable;

  // A part picked out by a link: make sure it is listed (its category open, the list long
  // enough), then bring it into view once it is on screen.
  const [focusHandled, setFocusHandled] = useState<string | null>(null);
  useEffect(() => {
    if (!focusPartId || focusHandled === focusPartId) return;
    const row = table.getRowModel().flatRows.find((r) => r.id === focusPartId);
    const parent = row?.getParentRow();
    if (parent && !parent.getIsExpanded()) {
      parent.toggleExpanded(true);
      return;
    }
    const position = table
      .getRowModel()
      .rows.filter((r) => !r.getIsGrouped())
      .findIndex((r) => r.id === focusPartId);
    if (position >= limit) {
      setLimit(Math.ceil((position + 1) / rowsPerStep) * rowsPerStep);
      return;
    }
    const element = document.getElementById(partElementId(focusPartId));
    if (element) {
      element.scrollIntoView({ block: 'center' });
      element.focus({ preventScroll: true });
    }
    setFocusHandled(focusPartId);
  }, [focusPartId, focusHandled, limit, table, allRows]);
  const visibleKey = table
    .getVisibleLeafColumns()
    .map((c) => c.id)
    .join(',');
  // From the deferred search, so the count always describes the list on screen.
  const anyFilter = Boolean(deferredSearch.trim() || filters.category || filters.status);

  const clearFilters = useCallback(() => {
    setSearch('');
    setFilters({ category: '', status: '' });
  }, []);

  const categoryCounts = useMemo(() => {
    const counts = new Map<PartCategory, number>();
    for (const p of parts) counts.set(p.category, (counts.get(p.category) ?? 0) + 1);
    return counts;
  }, [parts]);
  const statusCounts = useMemo(() => {
    const counts = new Map<PartStatus, number>();
    for (const p of parts) counts.set(p.status, (counts.get(p.status) ?? 0) + 1);
    return counts;
  }, [parts]);

  const sortable = table
    .getAllLeafColumns()
    .filter((c) => c.getCanSort() && c.getIsVisible())
    .map((c) => ({ id: c.id, label: (c.columnDef.meta as ColumnMeta | undefined)?.label ?? c.id }));

  return (
    <LedgerActionsContext.Provider value={actions}>
      <div className="flex flex-col gap-4">
        <LedgerToolbar
          search={search}
          onSearch={setSearch}
          filters={filters}
          onFilters={setFilters}
          grouped={grouped}
          onGrouped={setGrouped}
          categoryOptions={partCategories
            .filter((c) => categoryCounts.has(c) || filters.category === c)
            .map((c) => ({
              value: c,
              label: `${partCategoryLabels[c]} (${categoryCounts.get(c) ?? 0})`,
            }))}
          statusOptions={partStatuses
            .filter((s) => statusCounts.has(s) || filters.status === s)
            .map((s) => ({
              value: s,
              label: `${partStatusLabels[s]} (${statusCounts.get(s) ?? 0})`,
            }))}
          sort={
            wide
              ? undefined
              : {
                  options: sortable,
                  value: sorting[0] ?? null,
                  onChange: (next) => setSorting(next ? [next] : []),
                }
          }
          columnChooser={wide ? <ColumnChooser table={table} grouped={grouped} /> : undefined}
          actions={toolbarActions}
        />

        <div className="flex flex-wrap items-baseline justify-between gap-x-4 gap-y-1 text-[15px]">
          <p aria-live="polite" className="text-ink-2">
            {anyFilter
              ? `Showing ${filteredRows.length} of ${parts.length} parts`
              : `${parts.length} ${parts.length === 1 ? 'part' : 'parts'}`}
          </p>
          {money === 'full' && filteredRows.length > 0 && (
            <p className="text-ink-2">
              {anyFilter ? 'Total shown' : 'Total'}:{' '}
              <span className="font-bold text-ink tabular-nums">
                {cachedMoney(liveTotalOf(filteredRows), actions.currency)}
              </span>
              {filteredRows.some((r) => r.original.status === 'returned') && (
                <span className="text-muted"> (sent-back parts not counted)</span>
              )}
            </p>
          )}
        </div>

        {filteredRows.length === 0 ? (
          <EmptyState
            icon={<SearchX aria-hidden className="size-6" />}
            title="No parts match"
            actions={
              <Button variant="secondary" onClick={clearFilters}>
                Clear search and filters
              </Button>
            }
          >
            Nothing in the ledger matches this search and these filters.
          </EmptyState>
        ) : wide ? (
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
                            sorted === 'asc'
                              ? 'ascending'
                              : sorted === 'desc'
                                ? 'descending'
                                : undefined
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
                      currency={actions.currency}
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
        ) : (
          <ul aria-label="Parts" className="flex flex-col gap-3">
            {rows.map((row) =>
              row.getIsGrouped() ? (
                <GroupHeading
                  key={row.id}
                  row={row}
                  money={money}
                  currency={actions.currency}
                  isExpanded={row.getIsExpanded()}
                  listed={page.cut?.header === row ? page.cut.listed : undefined}
                />
              ) : (
                <PartCard
                  key={row.id}
                  part={row.original}
                  money={money}
                  picked={row.id === focusPartId}
                  headingLevel={grouped ? 3 : 2}
                />
              ),
            )}
          </ul>
        )}

        {hiddenParts > 0 && (
          <div className="flex flex-col items-center gap-2 rounded-lg border border-dashed border-rule-strong px-4 py-4 text-center sm:flex-row sm:justify-between sm:text-left">
            <p className="text-ink-2" data-testid="ledger-listing">
              Listing {page.listed} of {filteredRows.length} parts
              {inClosedCategories > 0 ? ` (${inClosedCategories} in closed categories)` : ''}.
              Search or filter to find one quickly.
            </p>
            <div className="flex flex-wrap justify-center gap-2">
              <Button variant="secondary" onClick={() => setLimit((l) => l + rowsPerStep)}>
                Show {Math.min(rowsPerStep, hiddenParts)} more
              </Button>
              <Button variant="ghost" onClick={() => setLimit(Number.POSITIVE_INFINITY)}>
                Show all
              </Button>
            </div>
          </div>
        )}
      </div>
    </LedgerActionsContext.Provider>
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
const GroupRow = memo(function GroupRow({
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
function GroupHeading({
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
