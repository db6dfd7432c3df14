import { useEffect, useReducer } from 'react';
import { onlineManager, useMutationState, useQueryClient } from '@tanstack/react-query';
import { CloudOff, Wifi } from 'lucide-react';
import { useMe } from '@/lib/me';
import { cn } from '@/components/ui/cn';
import { signOutKey } from '@/features/auth/api/sign-out';
import { formatWhen } from '@/lib/dates';
import { lastUser, persistCacheFor } from '@/lib/offline-cache';
import { openQueue, useOfflineQueue } from '@/lib/offline-queue';

/**
 * Follows the signed-in user: their saved cache and their queue of waiting writes (another
 * user's are never opened, so never sent under this session).
 */
function useOfflineUser(userId: string | null) {
  const queryClient = useQueryClient();
  useEffect(() => {
    if (userId && lastUser() && lastUser() !== userId) {
      // The cache restored at start belonged to the previous user of this device.
      queryClient.removeQueries({ predicate: (q) => q.queryKey[0] !== 'me' });
    }
    void persistCacheFor(userId);
    void openQueue(userId);
  }, [queryClient, userId]);
}

const entries = (n: number) => `${n} ${n === 1 ? 'entry' : 'entries'}`;

/** How long after the queue last sent something the line still says so. */
const recentMs = 30 * 60_000;

/**
 * One line under the header when there is something to say: offline (and a sign-out that
 * could not go for it), entries waiting or refused, sending, sent in the last half hour.
 * Online with nothing waiting (the owner at a desk, most of the time) it is an empty live
 * region, there for the next change to be read out.
 */
export function OfflineStatus() {
  const me = useMe();
  const userId = me.data?.id ?? null;
  useOfflineUser(userId);
  const { online, items, lastSentAt, sending } = useOfflineQueue();
  const queryClient = useQueryClient();
  // The last sign-out tried failed for want of signal (it fails at once: lib/query-client.ts).
  const signOuts = useMutationState({
    filters: { mutationKey: signOutKey },
    select: (m) => m.state.status,
  });
  const signOutFailed = signOuts.at(-1) === 'error' && !online;
  useEffect(() => {
    onlineManager.setOnline(online);
    // Back online, an old failed sign-out is history: not shown again at the next loss of signal.
    if (!online) return;
    const cache = queryClient.getMutationCache();
    for (const m of cache.findAll({ mutationKey: signOutKey, status: 'error' })) cache.remove(m);
  }, [online, queryClient]);
  // "last sent" goes quiet by itself once it is half an hour old.
  const [, rerender] = useReducer((n: number) => n + 1, 0);
  useEffect(() => {
    if (!lastSentAt) return;
    const left = recentMs - (Date.now() - Date.parse(lastSentAt));
    if (left <= 0) return;
    const timer = setTimeout(rerender, left + 100);
    return () => clearTimeout(timer);
  }, [lastSentAt]);
  if (!userId) return null;
  const refused = items.filter((i) => i.problem).length;
  const waiting = items.length - refused;
  const recentlySent = !!lastSentAt && Date.now() - Date.parse(lastSentAt) < recentMs;
  const quiet = online && items.length === 0 && !sending && !recentlySent;
  const parts = [
    online ? 'Online' : 'Offline: new entries are kept on this phone',
    waiting ? `${entries(waiting)} waiting to send` : '',
    refused ? `${entries(refused)} refused: see the step` : '',
    sending ? 'sending…' : '',
    lastSentAt ? `last sent ${formatWhen(lastSentAt)}` : '',
    signOutFailed ? 'signing out needs signal' : '',
  ].filter(Boolean);
  // The same elements quiet or not, so the live region is updated, not replaced (a region
  // that appears with its text already in it is often not read out).
  return (
    <div
      className={cn(
        'print:hidden',
        !quiet && 'border-b border-rule',
        !quiet && (online ? 'bg-sheet text-ink-2' : 'bg-tight-soft text-ink'),
      )}
    >
      <p
        role="status"
        data-testid="offline-status"
        className={
          quiet ? 'sr-only' : 'mx-auto flex max-w-5xl items-center gap-2 px-4 py-1 text-sm'
        }
      >
        {!quiet &&
          (online ? (
            <Wifi aria-hidden className="size-4 shrink-0" />
          ) : (
            <CloudOff aria-hidden className="size-4 shrink-0" />
          ))}
        {!quiet && <span>{parts.join(' · ')}</span>}
      </p>
    </div>
  );
}
