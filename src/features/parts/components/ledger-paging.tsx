import { Button } from '@/components/ui/button';
import { rowsPerStep } from './use-ledger-table';

/** Below a long list: how many parts are listed, and "Show more" / "Show all". */
export function LedgerPaging({
  listed,
  total,
  inClosedCategories,
  hiddenParts,
  setLimit,
}: {
  listed: number;
  total: number;
  inClosedCategories: number;
  hiddenParts: number;
  setLimit: (update: (limit: number) => number) => void;
}) {
  return (
    <div className="flex flex-col items-center gap-2 rounded-lg border border-dashed border-rule-strong px-4 py-4 text-center sm:flex-row sm:justify-between sm:text-left">
      <p className="text-ink-2" data-testid="ledger-listing">
        Listing {listed} of {total} parts
        {inClosedCategories > 0 ? ` (${inClosedCategories} in closed categories)` : ''}. Search or
        filter to find one quickly.
      </p>
      <div className="flex flex-wrap justify-center gap-2">
        <Button variant="secondary" onClick={() => setLimit((l) => l + rowsPerStep)}>
          Show {Math.min(rowsPerStep, hiddenParts)} more
        </Button>
        <Button variant="ghost" onClick={() => setLimit(() => Number.POSITIVE_INFINITY)}>
          Show all
        </Button>
      </div>
    </div>
  );
}
