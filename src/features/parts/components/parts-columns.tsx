import { createContext, useContext } from 'react';
import {
  aggregationFn_sum,
  columnFilteringFeature,
  columnGroupingFeature,
  columnVisibilityFeature,
  constructAggregationFn,
  createColumnHelper,
  createExpandedRowModel,
  createFilteredRowModel,
  createGroupedRowModel,
  createSortedRowModel,
  globalFilteringFeature,
  rowAggregationFeature,
  rowExpandingFeature,
  rowSortingFeature,
  tableFeatures,
  type FilterFn,
  type Row,
  type SortFn,
} from '@tanstack/react-table';
import { Pencil, Trash2 } from 'lucide-react';
import { formatNumber } from '@shared/format';
import {
  partCategories,
  partCategoryLabels,
  partStatuses,
  ratingUnitLabels,
  type Part,
  type PartStatus,
} from '@shared/schemas/parts';
import { cn } from '@/components/ui/cn';
import { cachedDate, cachedMoney } from '../lib/format-cache';
import { StatusBadge } from './status-badge';
import { StatusSelect } from './status-select';

/** Only the table features the ledger uses, so the rest stay out of the bundle. */
export const partsFeatures = tableFeatures({
  columnFilteringFeature,
  globalFilteringFeature,
  rowSortingFeature,
  columnGroupingFeature,
  rowExpandingFeature,
  columnVisibilityFeature,
  rowAggregationFeature,
  filteredRowModel: createFilteredRowModel(),
  groupedRowModel: createGroupedRowModel(),
  sortedRowModel: createSortedRowModel(),
  expandedRowModel: createExpandedRowModel(),
  aggregationFns: { sum: aggregationFn_sum },
});
export type PartsFeatures = typeof partsFeatures;
export type PartRow = Row<PartsFeatures, Part>;

/** What the cells need from the page: the currency and what this role may do. */
export type LedgerActions = {
  currency: string;
  onStatusChange?: (part: Part, status: PartStatus) => Promise<unknown>;
  onEdit?: (part: Part) => void;
  onDelete?: (part: Part) => void;
};
export const LedgerActionsContext = createContext<LedgerActions>({ currency: 'USD' });
export const useLedgerActions = () => useContext(LedgerActionsContext);

/** Which money a role receives: all of it (owner), its own labour quote (shop) or none. */
export type MoneyView = 'full' | 'quote' | 'none';

export function moneyViewOf(parts: Part[], fallback: MoneyView): MoneyView {
  const first = parts[0];
  if (!first) return fallback;
  if (first.totalCents !== undefined) return 'full';
  if (first.labourCents !== undefined) return 'quote';
  return 'none';
}

const collator = new Intl.Collator(undefined, { numeric: true, sensitivity: 'base' });
const categoryRank = Object.fromEntries(partCategories.map((c, i) => [c, i]));
const statusRank = Object.fromEntries(partStatuses.map((s, i) => [s, i]));

const textSort: SortFn<PartsFeatures, Part> = (a, b, id) =>
  collator.compare(String(a.getValue(id) ?? ''), String(b.getValue(id) ?? ''));
const rankSort =
  (rank: Record<string, number>): SortFn<PartsFeatures, Part> =>
  (a, b, id) =>
    (rank[String(a.getValue(id))] ?? 99) - (rank[String(b.getValue(id))] ?? 99);
const numberSort: SortFn<PartsFeatures, Part> = (a, b, id) =>
  Number(a.getValue(id) ?? 0) - Number(b.getValue(id) ?? 0);
const dateSort: SortFn<PartsFeatures, Part> = (a, b, id) =>
  String(a.getValue(id)).localeCompare(String(b.getValue(id)));

const equalsFilter: FilterFn<PartsFeatures, Part> = (row, id, value) => row.getValue(id) === value;

/** Lower-cased text a part is found by; built once per part object (parts are immutable). */
const searchText = new WeakMap<Part, string>();
function haystack(p: Part): string {
  let text = searchText.get(p);
  if (text === undefined) {
    text = [
      p.name,
      p.vendor,
      p.partNumber,
      p.shopName ?? '',
      p.notes,
      p.ratingFor,
      partCategoryLabels[p.category],
    ]
      .join('\n')
      .toLowerCase();
    searchText.set(p, text);
  }
  return text;
}

/** The free-text search: every word typed must appear somewhere in the part. */
export const partSearchFilter: FilterFn<PartsFeatures, Part> = Object.assign(
  (row: PartRow, _id: string, words: string[]) => {
    const text = haystack(row.original);
    return words.every((w) => text.includes(w));
  },
  {
    resolveFilterValue: (value: unknown) =>
      String(value ?? '')
        .toLowerCase()
        .split(/\s+/)
        .filter(Boolean),
    autoRemove: (value: unknown) => !String(value ?? '').trim(),
  },
);

/** Money a part adds to the build: sent-back parts count for nothing, as in the budget. */
const liveTotal = constructAggregationFn<PartsFeatures, Part, number | undefined, number>({
  aggregate: ({ rows }) =>
    rows.reduce(
      (sum, row) =>
        row.original.status === 'returned' ? sum : sum + (row.original.totalCents ?? 0),
      0,
    ),
});

function Money({ cents, muted }: { cents: number | undefined; muted?: boolean }) {
  const { currency } = useLedgerActions();
  if (cents === undefined) return null;
  return (
    <span className={cn('tabular-nums', muted && 'text-muted line-through')}>
      {cachedMoney(cents, currency)}
    </span>
  );
}

function DateCell({ value }: { value: string | null | undefined }) {
  if (!value) return <span className="text-muted">—</span>;
  return (
    <time dateTime={value} className="whitespace-nowrap tabular-nums">
      {cachedDate(value)}
    </time>
  );
}

function StatusCell({ part }: { part: Part }) {
  const { onStatusChange } = useLedgerActions();
  return (
    <div className="flex flex-col gap-1">
      {onStatusChange ? (
        <StatusSelect part={part} onChange={onStatusChange} />
      ) : (
        <StatusBadge status={part.status} />
      )}
      {part.status === 'at-shop' && part.shopName && (
        <span className="text-sm text-muted">with {part.shopName}</span>
      )}
    </div>
  );
}

export function RowActions({ part, className }: { part: Part; className?: string }) {
  const { onEdit, onDelete } = useLedgerActions();
  if (!onEdit && !onDelete) return null;
  return (
    <div className={cn('flex items-center justify-end gap-1', className)}>
      {onEdit && (
        <button
          type="button"
          aria-label={`Edit ${part.name}`}
          title="Edit"
          onClick={() => onEdit(part)}
          className="inline-flex size-11 items-center justify-center rounded-md text-ink-2 hover:bg-ink/5 hover:text-ink"
        >
          <Pencil aria-hidden className="size-4.5" />
        </button>
      )}
      {onDelete && (
        <button
          type="button"
          aria-label={`Delete ${part.name}`}
          title="Delete"
          onClick={() => onDelete(part)}
          className="inline-flex size-11 items-center justify-center rounded-md text-over hover:bg-over-soft"
        >
          <Trash2 aria-hidden className="size-4.5" />
        </button>
      )}
    </div>
  );
}

export type ColumnMeta = { align?: 'right'; label: string; money?: boolean };

const helper = createColumnHelper<PartsFeatures, Part>();

const undef = <T,>(v: T | null | undefined) => (v == null ? undefined : v);

/** Every column the ledger can show; money columns only exist when the role receives money. */
export function buildPartColumns(money: MoneyView) {
  const moneyColumn = (
    key:
      | 'unitPriceCents'
      | 'labourCents'
      | 'shippingCents'
      | 'taxCents'
      | 'coreChargeCents'
      | 'coreRefundCents',
    label: string,
    id: string = key,
  ) =>
    helper.accessor((p) => p[key], {
      id,
      header: label,
      meta: { align: 'right', label, money: true } satisfies ColumnMeta,
      sortFn: numberSort,
      enableGlobalFilter: false,
      cell: (c) => <Money cents={c.getValue()} />,
    });

  const columns = [
    helper.accessor('name', {
      header: 'Part',
      meta: { label: 'Part' } satisfies ColumnMeta,
      sortFn: textSort,
      enableHiding: false,
      cell: (c) => <span className="font-semibold break-words text-ink">{c.getValue()}</span>,
    }),
    helper.accessor('category', {
      header: 'Category',
      meta: { label: 'Category' } satisfies ColumnMeta,
      sortFn: rankSort(categoryRank),
      filterFn: equalsFilter,
      enableGlobalFilter: false,
      cell: (c) => partCategoryLabels[c.getValue()],
    }),
    helper.accessor('status', {
      header: 'Status',
      meta: { label: 'Status' } satisfies ColumnMeta,
      sortFn: rankSort(statusRank),
      filterFn: equalsFilter,
      enableHiding: false,
      enableGlobalFilter: false,
      cell: (c) => <StatusCell part={c.row.original} />,
    }),
    helper.accessor('vendor', {
      header: 'Vendor',
      meta: { label: 'Vendor' } satisfies ColumnMeta,
      sortFn: textSort,
      enableGlobalFilter: false,
      cell: (c) => c.getValue() || <span className="text-muted">—</span>,
    }),
    helper.accessor('partNumber', {
      header: 'Part no.',
      meta: { label: 'Part number' } satisfies ColumnMeta,
      sortFn: textSort,
      enableGlobalFilter: false,
      cell: (c) => <span className="break-all">{c.getValue() || '—'}</span>,
    }),
    helper.accessor('quantity', {
      header: 'Qty',
      meta: { align: 'right', label: 'Quantity' } satisfies ColumnMeta,
      sortFn: numberSort,
      enableGlobalFilter: false,
      cell: (c) => <span className="tabular-nums">{c.getValue()}</span>,
    }),
    helper.accessor((p) => p.shopName ?? undefined, {
      id: 'shop',
      header: 'Shop',
      meta: { label: 'Shop' } satisfies ColumnMeta,
      sortFn: textSort,
      sortUndefined: 'last',
      enableGlobalFilter: false,
      cell: (c) => c.getValue() ?? <span className="text-muted">—</span>,
    }),
    helper.accessor((p) => undef(p.ratingValue), {
      id: 'rating',
      header: 'Rating',
      meta: { label: 'Rating' } satisfies ColumnMeta,
      sortFn: numberSort,
      sortUndefined: 'last',
      enableGlobalFilter: false,
      cell: (c) => <RatingText part={c.row.original} />,
    }),
    ...(
      [
        ['orderedOn', 'Ordered'],
        ['expectedOn', 'Expected'],
        ['receivedOn', 'Received'],
        ['sentOutOn', 'Sent out'],
        ['backOn', 'Back'],
        ['installedOn', 'Installed'],
      ] as const
    ).map(([key, label]) =>
      helper.accessor((p) => undef(p[key]), {
        id: key,
        header: label,
        meta: { label } satisfies ColumnMeta,
        sortFn: dateSort,
        sortUndefined: 'last',
        enableGlobalFilter: false,
        cell: (c) => <DateCell value={c.getValue()} />,
      }),
    ),
    ...(money === 'full'
      ? [
          moneyColumn('unitPriceCents', 'Unit price'),
          moneyColumn('labourCents', 'Labor'),
          moneyColumn('shippingCents', 'Shipping'),
          moneyColumn('taxCents', 'Tax'),
          moneyColumn('coreChargeCents', 'Core charge'),
          moneyColumn('coreRefundCents', 'Core refund'),
          helper.accessor((p) => p.totalCents, {
            id: 'totalCents',
            header: 'Total',
            meta: { align: 'right', label: 'Total', money: true } satisfies ColumnMeta,
            sortFn: numberSort,
            enableGlobalFilter: false,
            aggregationFn: liveTotal,
            cell: (c) => (
              <Money cents={c.getValue()} muted={c.row.original.status === 'returned'} />
            ),
          }),
        ]
      : money === 'quote'
        ? [moneyColumn('labourCents', 'Your quote', 'quoteCents')]
        : []),
    helper.display({
      id: 'actions',
      header: () => <span className="sr-only">Actions</span>,
      meta: { align: 'right', label: 'Actions' } satisfies ColumnMeta,
      enableHiding: false,
      cell: (c) => <RowActions part={c.row.original} />,
    }),
  ];
  return helper.columns(columns);
}

export function RatingText({ part }: { part: Part }) {
  if (part.ratingValue == null || !part.ratingUnit) return <span className="text-muted">—</span>;
  return (
    <span title={part.ratingFor || undefined} className="whitespace-nowrap tabular-nums">
      {formatNumber(part.ratingValue, 1)} {ratingUnitLabels[part.ratingUnit]}
    </span>
  );
}

/** Columns shown until the user chooses otherwise. */
export const defaultColumnVisibility: Record<string, boolean> = {
  category: true,
  vendor: true,
  partNumber: false,
  quantity: true,
  shop: false,
  rating: false,
  orderedOn: false,
  expectedOn: true,
  receivedOn: false,
  sentOutOn: false,
  backOn: false,
  installedOn: false,
  unitPriceCents: false,
  labourCents: false,
  shippingCents: false,
  taxCents: false,
  coreChargeCents: false,
  coreRefundCents: false,
  totalCents: true,
};
