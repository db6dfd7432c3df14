import { useState } from 'react';
import { LoaderCircle } from 'lucide-react';
import { partStatuses, type Part, type PartStatus } from '@shared/schemas/parts';
import { cn } from '@/components/ui/cn';
import { isApiError } from '@/lib/api-client';
import { statusLabel, statusTone } from '../lib/status';
import { statusIcon } from './status-badge';

/**
 * The status of a part, changed right where it is listed. The select shows the new status
 * at once and goes back to the saved one if the server refuses; the reason is shown below.
 */
export function StatusSelect({
  part,
  onChange,
  className,
}: {
  part: Part;
  onChange: (part: Part, status: PartStatus) => Promise<unknown>;
  className?: string;
}) {
  const [draft, setDraft] = useState<PartStatus | null>(null);
  const [error, setError] = useState<string | null>(null);
  const shown = draft ?? part.status;
  const Icon = statusIcon[shown];

  return (
    <div className={cn('flex min-w-0 flex-col gap-1', className)}>
      <div className="relative inline-flex w-full max-w-52 min-w-40 items-center">
        <Icon aria-hidden className="pointer-events-none absolute left-2.5 size-4 text-current" />
        <select
          aria-label={`Status of ${part.name}`}
          value={shown}
          disabled={draft !== null}
          className={cn(
            'min-h-11 w-full cursor-pointer appearance-none rounded-md border py-1.5 pr-8 pl-8 text-[15px] font-semibold',
            'disabled:cursor-wait',
            statusTone[shown],
            'no-underline',
          )}
          onChange={(event) => {
            const status = event.target.value as PartStatus;
            if (status === part.status) return;
            setDraft(status);
            setError(null);
            onChange(part, status)
              .catch((err: unknown) =>
                setError(isApiError(err) ? err.message : 'Could not change the status. Try again.'),
              )
              .finally(() => setDraft(null));
          }}
        >
          {partStatuses.map((s) => (
            <option key={s} value={s}>
              {statusLabel(s)}
            </option>
          ))}
        </select>
        {draft !== null ? (
          <LoaderCircle
            aria-hidden
            className="pointer-events-none absolute right-2 size-4 animate-spin"
          />
        ) : (
          // A plain SVG, not an icon component: one of these sits in every ledger row.
          <svg
            aria-hidden
            viewBox="0 0 24 24"
            className="pointer-events-none absolute right-2 size-4"
            fill="none"
            stroke="currentColor"
            strokeWidth="2"
            strokeLinecap="round"
            strokeLinejoin="round"
          >
            <path d="m6 9 6 6 6-6" />
          </svg>
        )}
      </div>
      {error && (
        <p role="alert" className="text-sm font-semibold text-over">
          {error}
        </p>
      )}
    </div>
  );
}
