import { useEffect, useRef } from 'react';
import { Columns3 } from 'lucide-react';
import type { ReactTable } from '@tanstack/react-table';
import type { Part } from '@shared/schemas/parts';
import type { ColumnMeta, PartsFeatures } from './parts-columns';

/** Show or hide the ledger's columns; the choice is remembered in this browser. */
export function ColumnChooser({
  table,
  grouped,
}: {
  table: ReactTable<PartsFeatures, Part, unknown>;
  grouped: boolean;
}) {
  const ref = useRef<HTMLDetailsElement>(null);

  // Closes like a menu: a click elsewhere or Escape.
  useEffect(() => {
    const close = (event: Event) => {
      const details = ref.current;
      if (!details?.open) return;
      if (event instanceof KeyboardEvent) {
        if (event.key !== 'Escape') return;
        details.open = false;
        details.querySelector('summary')?.focus();
        return;
      }
      if (!details.contains(event.target as Node)) details.open = false;
    };
    document.addEventListener('pointerdown', close);
    document.addEventListener('keydown', close);
    return () => {
      document.removeEventListener('pointerdown', close);
      document.removeEventListener('keydown', close);
    };
  }, []);

  const columns = table.getAllLeafColumns().filter((c) => c.getCanHide());

  return (
    <details ref={ref} className="relative">
      <summary className="inline-flex min-h-11 cursor-pointer list-none items-center gap-2 rounded-md border border-rule-strong bg-sheet px-3 font-semibold text-ink shadow-sm hover:border-ink-3 [&::-webkit-details-marker]:hidden">
        <Columns3 aria-hidden className="size-4" />
        Columns
      </summary>
      <fieldset className="absolute left-0 z-30 mt-1 w-64 rounded-lg border border-rule-strong bg-sheet p-3 shadow-xl">
        <legend className="sr-only">Columns to show</legend>
        <p className="mb-1 text-sm text-muted">Part, status and actions always show.</p>
        <ul className="max-h-80 overflow-y-auto">
          {columns.map((column) => {
            const label = (column.columnDef.meta as ColumnMeta | undefined)?.label ?? column.id;
            const lockedByGrouping = grouped && column.id === 'category';
            return (
              <li key={column.id}>
                <label className="flex min-h-11 cursor-pointer items-center gap-2.5 text-[15px]">
                  <input
                    type="checkbox"
                    className="size-5 accent-accent-600"
                    checked={lockedByGrouping ? false : column.getIsVisible()}
                    disabled={lockedByGrouping}
                    onChange={(e) => column.toggleVisibility(e.target.checked)}
                  />
                  {label}
                  {lockedByGrouping && <span className="text-sm text-muted">(grouped)</span>}
                </label>
              </li>
            );
          })}
        </ul>
      </fieldset>
    </details>
  );
}
