import { useState } from 'react';
import { CloudUpload } from 'lucide-react';
import { Button } from '@/components/ui/button';
import { formatWhen } from '@/lib/dates';
import { discard, useOfflineQueue, type QueuedWrite } from '@/lib/offline-queue';

/** The entry in words, for copying before it is discarded. */
function asText(item: QueuedWrite) {
  return `${item.label} — recorded ${formatWhen(item.recordedAt)}${item.problem ? ` — not saved: ${item.problem.message}` : ''}`;
}

function Refused({ item }: { item: QueuedWrite }) {
  const [copied, setCopied] = useState(false);
  return (
    <li className="flex flex-col gap-2 px-4 py-3 sm:px-5">
      <p className="text-[17px] font-semibold">{item.label}</p>
      <p role="alert" className="text-[15px] font-semibold text-over">
        Not saved: {item.problem!.message}
      </p>
      <p className="text-sm text-muted">Recorded on this phone {formatWhen(item.recordedAt)}.</p>
      <div className="flex flex-wrap gap-2">
        <Button
          variant="secondary"
          size="sm"
          className="min-h-11!"
          onClick={() =>
            void navigator.clipboard.writeText(asText(item)).then(() => setCopied(true))
          }
        >
          {copied ? 'Copied' : 'Copy'}
        </Button>
        <Button
          variant="secondary"
          size="sm"
          className="min-h-11!"
          onClick={() => void discard(item.key)}
        >
          Discard
        </Button>
      </div>
    </li>
  );
}

/**
 * What this step has waiting on the phone: entries recorded without signal, in the order
 * they will be sent, and any the server refused (kept with its message to copy or discard).
 */
export function WaitingEntries({ stepId }: { stepId: string }) {
  const { items, online } = useOfflineQueue();
  const mine = items.filter((i) => i.stepId === stepId);
  if (!mine.length) return null;
  const waiting = mine.filter((i) => !i.problem);
  const refused = mine.filter((i) => i.problem);
  return (
    <section
      aria-labelledby="waiting-title"
      className="overflow-hidden rounded-lg border border-tight bg-tight-soft"
    >
      <h2
        id="waiting-title"
        className="flex items-center gap-2 px-4 pt-3 text-lg font-bold sm:px-5"
      >
        <CloudUpload aria-hidden className="size-5" />
        On this phone
      </h2>
      {waiting.length > 0 && (
        <>
          <p className="px-4 text-[15px] text-ink-2 sm:px-5">
            Waiting to send{online ? '' : ' when the network returns'}, in this order:
          </p>
          <ol className="divide-y divide-rule">
            {waiting.map((i) => (
              <li key={i.key} className="px-4 py-2 sm:px-5" data-testid="waiting-entry">
                <span className="font-semibold">{i.label}</span>{' '}
                <span className="text-sm text-ink-2">
                  · waiting to send · recorded {formatWhen(i.recordedAt)}
                </span>
              </li>
            ))}
          </ol>
        </>
      )}
      {refused.length > 0 && (
        <ul className="divide-y divide-rule border-t border-rule bg-sheet">
          {refused.map((i) => (
            <Refused key={i.key} item={i} />
          ))}
        </ul>
      )}
    </section>
  );
}
