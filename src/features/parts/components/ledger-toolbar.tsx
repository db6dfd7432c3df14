import type { ReactNode } from 'react';
import { Search, X } from 'lucide-react';
import type { PartCategory, PartStatus } from '@shared/schemas/parts';
import { SelectInput, TextInput } from '@/components/ui/form-field';

export type LedgerFilters = { category: PartCategory | ''; status: PartStatus | '' };

type SortValue = { id: string; desc: boolean } | null;

/** Search, category and status filters, grouping, column choice and the page's actions. */
export function LedgerToolbar({
  search,
  onSearch,
  filters,
  onFilters,
  grouped,
  onGrouped,
  categoryOptions,
  statusOptions,
  sort,
  columnChooser,
  actions,
}: {
  search: string;
  onSearch: (text: string) => void;
  filters: LedgerFilters;
  onFilters: (filters: LedgerFilters) => void;
  grouped: boolean;
  onGrouped: (grouped: boolean) => void;
  categoryOptions: { value: PartCategory; label: string }[];
  statusOptions: { value: PartStatus; label: string }[];
  /** The phone list has no column headers to click, so it sorts with a select. */
  sort?: {
    options: { id: string; label: string }[];
    value: SortValue;
    onChange: (value: SortValue) => void;
  };
  columnChooser?: ReactNode;
  actions?: ReactNode;
}) {
  return (
    <div className="flex flex-col gap-3 rounded-lg border border-rule bg-sheet p-3 sm:p-4">
      <div className="grid grid-cols-2 gap-3 md:grid-cols-[minmax(14rem,1fr)_13rem_13rem]">
        <div className="relative col-span-2 md:col-span-1">
          <label htmlFor="parts-search" className="mb-1 block text-sm font-semibold text-ink">
            Search parts
          </label>
          <Search
            aria-hidden
            className="pointer-events-none absolute bottom-3 left-3 size-5 text-muted"
          />
          <TextInput
            id="parts-search"
            type="search"
            value={search}
            onChange={(e) => onSearch(e.target.value)}
            placeholder="Name, vendor, part number, shop…"
            autoComplete="off"
            className="pr-11 pl-10"
          />
          {search && (
            <button
              type="button"
              aria-label="Clear the search"
              onClick={() => onSearch('')}
              className="absolute right-0 bottom-0 inline-flex size-11 items-center justify-center text-muted hover:text-ink"
            >
              <X aria-hidden className="size-5" />
            </button>
          )}
        </div>
        <div>
          <label htmlFor="parts-category" className="mb-1 block text-sm font-semibold text-ink">
            Category
          </label>
          <SelectInput
            id="parts-category"
            value={filters.category}
            onChange={(e) =>
              onFilters({ ...filters, category: e.target.value as LedgerFilters['category'] })
            }
          >
            <option value="">All categories</option>
            {categoryOptions.map((o) => (
              <option key={o.value} value={o.value}>
                {o.label}
              </option>
            ))}
          </SelectInput>
        </div>
        <div>
          <label htmlFor="parts-status" className="mb-1 block text-sm font-semibold text-ink">
            Status
          </label>
          <SelectInput
            id="parts-status"
            value={filters.status}
            onChange={(e) =>
              onFilters({ ...filters, status: e.target.value as LedgerFilters['status'] })
            }
          >
            <option value="">All statuses</option>
            {statusOptions.map((o) => (
              <option key={o.value} value={o.value}>
                {o.label}
              </option>
            ))}
          </SelectInput>
        </div>
      </div>

      <div className="flex flex-wrap items-end gap-x-4 gap-y-2">
        <label className="inline-flex min-h-11 cursor-pointer items-center gap-2 font-semibold text-ink">
          <input
            type="checkbox"
            checked={grouped}
            onChange={(e) => onGrouped(e.target.checked)}
            className="size-5 accent-accent-600"
          />
          Group by category
        </label>
        {sort && (
          <div className="flex min-w-48 flex-1 flex-col">
            <label htmlFor="parts-sort" className="mb-1 block text-sm font-semibold text-ink">
              Sort by
            </label>
            <SelectInput
              id="parts-sort"
              value={sort.value ? `${sort.value.id}:${sort.value.desc ? 'desc' : 'asc'}` : ''}
              onChange={(e) => {
                const [id, dir] = e.target.value.split(':');
                sort.onChange(id ? { id, desc: dir === 'desc' } : null);
              }}
            >
              <option value="">As entered</option>
              {sort.options.flatMap((o) => [
                <option key={`${o.id}:asc`} value={`${o.id}:asc`}>
                  {o.label}, ascending
                </option>,
                <option key={`${o.id}:desc`} value={`${o.id}:desc`}>
                  {o.label}, descending
                </option>,
              ])}
            </SelectInput>
          </div>
        )}
        {columnChooser}
        {actions && <div className="ml-auto flex flex-wrap gap-2">{actions}</div>}
      </div>
    </div>
  );
}
