/**
 * TanStack Query's cache, saved on the device per user (IndexedDB through idb-keyval), so
 * the builds and steps a member has opened open again without signal. The API answers
 * authenticated JSON with `no-store`; this saved cache is the only copy kept. It is removed
 * at sign-out once no writes wait to be sent (else kept, but not opened until that user signs
 * in again).
 */
import { createAsyncStoragePersister } from '@tanstack/query-async-storage-persister';
import { persistQueryClient } from '@tanstack/react-query-persist-client';
import { createStore, del, get, set } from 'idb-keyval';
import { openQueue, queueDbName } from './offline-queue';
import { queryClient, savedCacheMaxAgeMs } from './query-client';

const lastUserKey = 'headroom-user';
const cacheDbName = (userId: string) => `headroom-cache-${userId}`;

let active: { userId: string; stop: () => void } | null = null;

/** The user whose saved cache opens with the app (the last one signed in on this device). */
export function lastUser(): string | null {
  try {
    return localStorage.getItem(lastUserKey);
  } catch {
    return null;
  }
}

/**
 * Restores this user's saved cache and keeps saving it; null stops saving (signed out).
 * Resolves once the saved queries are back in the cache.
 */
export function persistCacheFor(userId: string | null): Promise<void> {
  if (active?.userId === userId) return Promise.resolve();
  active?.stop();
  active = null;
  if (!userId) return Promise.resolve();
  localStorage.setItem(lastUserKey, userId);
  const store = createStore(cacheDbName(userId), 'cache');
  const persister = createAsyncStoragePersister({
    storage: {
      getItem: async (key) => (await get<string>(key, store)) ?? null,
      setItem: (key, value: string) => set(key, value, store),
      removeItem: (key) => del(key, store),
    },
    throttleTime: 1000,
  });
  const [stop, restored] = persistQueryClient({
    queryClient,
    persister,
    maxAge: savedCacheMaxAgeMs,
    buster: 'headroom-1',
  });
  active = { userId, stop };
  // What was saved is shown at once but always fetched again when the network allows: a
  // reload must never show data older than the server's, as it did before any was saved.
  return restored
    .then(() => queryClient.invalidateQueries({ refetchType: 'none' }))
    .catch(() => undefined);
}

/** At sign-out: stops saving, and removes the user's saved data unless writes still wait. */
export async function leaveDevice(userId: string, writesWaiting: boolean) {
  await persistCacheFor(null);
  await openQueue(null);
  // The app no longer opens to this user's saved data, even without signal: whoever uses the
  // device next sees the sign-in, not the last user's builds.
  localStorage.removeItem(lastUserKey);
  if (writesWaiting) return; // Kept, unopened, for the same user's next sign-in.
  for (const name of [cacheDbName(userId), queueDbName(userId)]) indexedDB.deleteDatabase(name);
}
