import { useId } from 'react';
import { Droplets, Plus } from 'lucide-react';
import { ButtonLink } from '@/components/ui/button';
import { Spinner } from '@/components/ui/spinner';
import { paths } from '@/config/paths';
import { useBenchSheets } from '../api/get-bench-sheets';
import { SheetList } from './sheet-list';

/** An injector set's bench sheets, inside the part's dialog. */
export function PartBenchSheets({
  buildId,
  partId,
  partName,
  canAdd,
}: {
  buildId: string;
  partId: string;
  partName: string;
  canAdd: boolean;
}) {
  const sheets = useBenchSheets(buildId, partId);
  const titleId = useId();
  return (
    <section aria-labelledby={titleId} className="border-t border-rule pt-2">
      <h2
        id={titleId}
        className="flex items-center gap-2 border-b border-rule px-4 py-2.5 text-lg font-bold sm:px-5"
      >
        <Droplets aria-hidden className="size-5 text-ink-3" />
        Bench sheets
        {sheets.data && sheets.data.length > 0 && (
          <span className="font-semibold text-muted">({sheets.data.length})</span>
        )}
      </h2>
      <div className="flex flex-col gap-3 px-4 py-4 sm:px-5">
        {sheets.isPending ? (
          <p role="status" className="flex items-center gap-2 text-muted">
            <Spinner className="size-5" /> Loading the bench sheets…
          </p>
        ) : sheets.isError ? (
          <p role="alert" className="font-semibold text-over">
            Could not load the bench sheets: {sheets.error.message}
          </p>
        ) : sheets.data.length === 0 ? (
          <p className="text-muted">No bench sheets for this injector set yet.</p>
        ) : (
          <SheetList buildId={buildId} sheets={sheets.data} label={`Bench sheets of ${partName}`} />
        )}
        {canAdd && (
          <ButtonLink
            to={paths.builds.benchNew.getHref(buildId, partId)}
            variant="secondary"
            className="self-start"
            icon={<Plus aria-hidden className="size-4" />}
          >
            Add a bench sheet
          </ButtonLink>
        )}
      </div>
    </section>
  );
}
