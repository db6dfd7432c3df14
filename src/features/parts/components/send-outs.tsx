import { useState } from 'react';
import { AlarmClock, PackageCheck } from 'lucide-react';
import { daysBetween } from '@shared/dates';
import { formatIsoDate, formatMoney } from '@shared/format';
import { partCategoryLabels, type Part } from '@shared/schemas/parts';
import { Alert } from '@/components/ui/alert';
import { Badge } from '@/components/ui/badge';
import { Button } from '@/components/ui/button';
import { cn } from '@/components/ui/cn';
import { isApiError } from '@/lib/api-client';
import { StatusBadge } from './status-badge';

/** Who has the part: the shop member it was sent to, else the vendor named on it. */
export function holderOf(part: Part): string | null {
  return part.shopName || part.vendor || null;
}

function daysOverdue(part: Part): number {
  if (!part.sendOut?.overdue || part.turnaroundDays == null) return 0;
  return part.sendOut.daysOut - part.turnaroundDays;
}

/** Overdue first (longest overdue on top), then the soonest due, then the longest away. */
export function sortAtShop(parts: Part[]): Part[] {
  return [...parts].sort((a, b) => {
    const overdue = daysOverdue(b) - daysOverdue(a);
    if (overdue) return overdue;
    const dueA = a.sendOut?.dueOn ?? '9999-12-31';
    const dueB = b.sendOut?.dueOn ?? '9999-12-31';
    if (dueA !== dueB) return dueA < dueB ? -1 : 1;
    return (b.sendOut?.daysOut ?? 0) - (a.sendOut?.daysOut ?? 0);
  });
}

function plural(n: number, word: string) {
  return `${n} ${word}${n === 1 ? '' : 's'}`;
}

function TurnaroundBar({ part }: { part: Part }) {
  const s = part.sendOut;
  if (!s || part.turnaroundDays == null) return null;
  const total = Math.max(part.turnaroundDays, 1);
  const share = Math.min(1, s.daysOut / total);
  const tone = s.overdue ? 'bg-over' : share >= 0.8 ? 'bg-tight' : 'bg-ink-3';
  return (
    <div
      role="progressbar"
      aria-label={`Days out of the promised ${part.turnaroundDays}`}
      aria-valuemin={0}
      aria-valuemax={part.turnaroundDays}
      aria-valuenow={Math.min(s.daysOut, part.turnaroundDays)}
      aria-valuetext={`Day ${s.daysOut} of ${part.turnaroundDays}`}
      className="h-2.5 w-full overflow-hidden rounded-full bg-ink/[0.08]"
    >
      <div className={cn('h-full rounded-full', tone)} style={{ width: `${share * 100}%` }} />
    </div>
  );
}

/** A part out at a shop: who has it, since when, and how that compares with the promise. */
export function AtShopCard({
  part,
  currency,
  quoteLabel,
  onBack,
}: {
  part: Part;
  currency: string;
  quoteLabel: string | null;
  onBack?: (part: Part) => Promise<unknown>;
}) {
  const [pending, setPending] = useState(false);
  const [error, setError] = useState<string | null>(null);
  const s = part.sendOut;
  const holder = holderOf(part);
  const overdueBy = daysOverdue(part);
  return (
    <li
      className={cn(
        'flex flex-col gap-3 rounded-lg border bg-sheet p-4',
        s?.overdue ? 'border-over/50 ring-1 ring-over/30' : 'border-rule',
      )}
    >
      <div className="flex flex-wrap items-start justify-between gap-2">
        <div className="min-w-0">
          <h3 className="text-lg leading-snug font-bold break-words">{part.name}</h3>
          <p className="text-[15px] text-muted">{partCategoryLabels[part.category]}</p>
        </div>
        {s?.overdue && (
          <Badge tone="over" className="text-[15px]">
            <AlarmClock aria-hidden className="size-4" />
            Overdue by {plural(overdueBy, 'day')}
          </Badge>
        )}
      </div>

      <dl className="grid grid-cols-2 gap-x-4 gap-y-2 text-[15px] sm:grid-cols-4">
        <div className="col-span-2 sm:col-span-1">
          <dt className="text-xs font-semibold tracking-wide text-muted uppercase">With</dt>
          <dd className="font-semibold break-words">{holder ?? 'Shop not recorded'}</dd>
        </div>
        <div>
          <dt className="text-xs font-semibold tracking-wide text-muted uppercase">Sent</dt>
          <dd>
            {part.sentOutOn ? (
              <time dateTime={part.sentOutOn}>{formatIsoDate(part.sentOutOn)}</time>
            ) : (
              <span className="text-muted">Date not recorded</span>
            )}
          </dd>
        </div>
        <div>
          <dt className="text-xs font-semibold tracking-wide text-muted uppercase">Due back</dt>
          <dd>
            {s?.dueOn ? (
              <time dateTime={s.dueOn}>{formatIsoDate(s.dueOn)}</time>
            ) : (
              <span className="text-muted">No turnaround promised</span>
            )}
          </dd>
        </div>
        {quoteLabel && part.labourCents !== undefined && (
          <div>
            <dt className="text-xs font-semibold tracking-wide text-muted uppercase">
              {quoteLabel}
            </dt>
            <dd className="tabular-nums">{formatMoney(part.labourCents, currency)}</dd>
          </div>
        )}
      </dl>

      {s && (
        <div className="flex flex-col gap-1.5">
          <p className={cn('text-[15px] font-semibold', s.overdue ? 'text-over' : 'text-ink-2')}>
            {part.turnaroundDays != null
              ? `Day ${s.daysOut} of ${part.turnaroundDays} promised`
              : `${plural(s.daysOut, 'day')} out`}
          </p>
          <TurnaroundBar part={part} />
        </div>
      )}

      {onBack && (
        <div className="flex flex-col gap-2">
          <Button
            variant="secondary"
            className="self-start"
            pending={pending}
            icon={<PackageCheck aria-hidden className="size-4" />}
            aria-label={`Mark ${part.name} back from the shop`}
            onClick={() => {
              setPending(true);
              setError(null);
              onBack(part)
                .catch((err: unknown) =>
                  setError(isApiError(err) ? err.message : 'Could not save that. Try again.'),
                )
                .finally(() => setPending(false));
            }}
          >
            Back from the shop
          </Button>
          {error && <Alert tone="error">{error}</Alert>}
        </div>
      )}
    </li>
  );
}

/** A part that has come back: how long it was away against what was promised. */
export function BackFromShopRow({ part }: { part: Part }) {
  const took = part.sentOutOn && part.backOn ? daysBetween(part.sentOutOn, part.backOn) : null;
  const late = took != null && part.turnaroundDays != null && took > part.turnaroundDays;
  return (
    <li className="flex flex-col gap-1 py-3 first:pt-0 last:pb-0 sm:flex-row sm:items-center sm:gap-4">
      <div className="min-w-0 flex-1">
        <p className="font-semibold break-words">{part.name}</p>
        <p className="text-[15px] text-muted">
          {holderOf(part) ?? 'Shop not recorded'}
          {part.sentOutOn && (
            <>
              {' · '}sent {formatIsoDate(part.sentOutOn)}
            </>
          )}
          {part.backOn && (
            <>
              {' · '}back {formatIsoDate(part.backOn)}
            </>
          )}
        </p>
      </div>
      <div className="flex flex-wrap items-center gap-2">
        {took != null && (
          <span
            className={cn(
              'text-[15px] tabular-nums',
              late ? 'font-semibold text-over' : 'text-ink-2',
            )}
          >
            Took {plural(took, 'day')}
            {part.turnaroundDays != null && ` (promised ${part.turnaroundDays})`}
          </span>
        )}
        <StatusBadge status={part.status} />
      </div>
    </li>
  );
}
