import type { ReactNode } from 'react';
import { SearchX } from 'lucide-react';
import {
  partCategories,
  partCategoryLabels,
  partStatuses,
  partStatusLabels,
  type Part,
} from '@shared/schemas/parts';
import { Button } from '@/components/ui/button';
import { EmptyState } from '@/components/ui/states';
import { cachedMoney } from '../lib/format-cache';
import { useMediaQuery } from '../lib/use-media-query';
import { ColumnChooser } from './column-chooser';
import { GroupHeading } from './ledger-groups';
import { LedgerPaging } from './ledger-paging';
import { LedgerTable } from './ledger-table';
import { LedgerToolbar } from './ledger-toolbar';
import { PartCard } from './part-card';
import { LedgerActionsContext, type LedgerActions, type MoneyView } from './parts-columns';
import { liveTotalOf, useLedgerTable } from './use-ledger-table';

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
  const {
    money,
    table,
    search,
    setSearch,
    filters,
    setFilters,
    sorting,
    setSorting,
    grouped,
    setGrouped,
    setLimit,
    page,
    rows,
    hiddenParts,
    inClosedCategories,
    filteredRows,
    visibleKey,
    anyFilter,
    clearFilters,
    categoryCounts,
    statusCounts,
    sortable,
  } = useLedgerTable({ parts, moneyFallback, initialSearch, focusPartId });

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
          <LedgerTable
            table={table}
            rows={rows}
            page={page}
            sorting={sorting}
            visibleKey={visibleKey}
            money={money}
            currency={actions.currency}
            focusPartId={focusPartId}
          />
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
          <LedgerPaging
            listed={page.listed}
            total={filteredRows.length}
            inClosedCategories={inClosedCategories}
            hiddenParts={hiddenParts}
            setLimit={setLimit}
          />
        )}
      </div>
    </LedgerActionsContext.Provider>
  );
}
