import { Link } from 'react-router-dom';
import { ChevronRight, Paperclip } from 'lucide-react';
import type { BenchSheetSummary } from '@shared/schemas/bench';
import { paths } from '@/config/paths';
import { dateText } from '../lib/format';
import { SheetStatusBadge } from './sheet-status-badge';

/** A part's sheets, oldest test first, each a link to its page with its verdict in words. */
export function SheetList({
  buildId,
  sheets,
  label,
}: {
  buildId: string;
  sheets: BenchSheetSummary[];
  label: string;
}) {
  return (
    <ul aria-label={label} className="flex flex-col gap-2">
      {sheets.map((s) => (
        <li key={s.id}>
          <Link
            to={paths.builds.benchSheet.getHref(buildId, s.id)}
            className="flex items-start gap-3 rounded-md border border-rule bg-white px-3 py-2.5 hover:border-ink-3"
          >
            <div className="min-w-0 flex-1">
              <p className="flex flex-wrap items-center gap-x-3 gap-y-1">
                <span className="text-[17px] font-bold break-words text-ink">{s.occasion}</span>
                <SheetStatusBadge status={s.status} />
              </p>
              <p className="text-sm text-muted">
                Tested <time dateTime={s.testedOn}>{dateText(s.testedOn)}</time>
                {s.testedBy && ` by ${s.testedBy}`}
                {s.enteredBy && ` · entered by ${s.enteredBy.name}`}
                {s.original && (
                  <span className="ml-1 inline-flex items-center gap-0.5">
                    · <Paperclip aria-hidden className="size-3.5" /> original attached
                  </span>
                )}
              </p>
              <p className="mt-0.5 text-[15px] break-words text-ink-2">{s.verdict}</p>
            </div>
            <ChevronRight aria-hidden className="mt-1 size-5 shrink-0 text-muted" />
          </Link>
        </li>
      ))}
    </ul>
  );
}
