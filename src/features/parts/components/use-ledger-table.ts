import { useCallback, useDeferredValue, useEffect, useMemo, useState } from 'react';
import {
  useTable,
  type ColumnFiltersState,
  type ColumnVisibilityState,
  type ExpandedState,
  type SortingState,
} from '@tanstack/react-table';
import {
  partCategories,
  type Part,
  type PartCategory,
  type PartStatus,
} from '@shared/schemas/parts';
import {
  loadColumnVisibility,
  loadGrouped,
  saveColumnVisibility,
  saveGrouped,
} from '../lib/column-prefs';
import { pageRows } from '../lib/page-rows';
import { partElementId } from '../lib/part-element-id';
import {
  buildPartColumns,
  defaultColumnVisibility,
  moneyViewOf,
  partSearchFilter,
  partsFeatures,
  type ColumnMeta,
  type MoneyView,
  type PartRow,
} from './parts-columns';
import type { LedgerFilters } from './ledger-toolbar';

/** Rows listed at first, and added by each "Show more". */
export const rowsPerStep = 40;

const categoryRank = Object.fromEntries(partCategories.map((c, i) => [c, i]));

/** Parts in the product's category order (the order groups appear in), then as the API sent them. */
function inCategoryOrder(parts: Part[]): Part[] {
  return parts
    .map((p, i) => ({ p, i }))
    .sort((a, b) => categoryRank[a.p.category] - categoryRank[b.p.category] || a.i - b.i)
    .map(({ p }) => p);
}

/** The total of the rows, sent-back parts not counted. */
export function liveTotalOf(rows: readonly PartRow[]): number {
  let sum = 0;
  for (const row of rows) {
    const p = row.original;
    if (p.status !== 'returned') sum += p.totalCents ?? 0;
  }
  return sum;
}

/**
 * The ledger's table state: search, filters, sorting, grouping by category, column choice
 * (remembered), the list's length ("Show more") and a part picked out by a link.
 */
export function useLedgerTable({
  parts,
  moneyFallback,
  initialSearch,
  focusPartId,
}: {
  parts: Part[];
  moneyFallback: MoneyView;
  initialSearch: string;
  focusPartId: string | null;
}) {
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

  return {
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
  };
}
