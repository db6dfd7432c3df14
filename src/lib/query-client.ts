import { onlineManager, QueryClient } from '@tanstack/react-query';
import { isApiError } from './api-client';

/** A 4xx will answer the same way a second time; only network failures and 5xx are retried. */
function shouldRetry(failureCount: number, error: unknown): boolean {
  if (isApiError(error) && error.status >= 400 && error.status < 500) return false;
  return failureCount < 2;
}

/** How long answers are kept, in memory and in the cache saved on the device for offline use. */
export const savedCacheMaxAgeMs = 7 * 24 * 60 * 60 * 1000;

export function createQueryClient(): QueryClient {
  return new QueryClient({
    defaultOptions: {
      queries: {
        staleTime: 30_000,
        // Kept as long as the saved cache, so a step opened days ago still opens offline.
        gcTime: savedCacheMaxAgeMs,
        retry: shouldRetry,
        refetchOnWindowFocus: true,
      },
      // Without signal a write is tried at once and fails with "Could not reach Headroom…"
      // beside its button, instead of spinning until the signal returns (TanStack's default
      // pauses it, and a reload loses it). Readings, ticks and step photos do not come here
      // offline: they go to the queue on the phone (lib/offline-queue.ts).
      mutations: { retry: false, networkMode: 'always' },
    },
  });
}

export const queryClient = createQueryClient();

// Opened without signal: queries wait for the network (showing what the device saved)
// instead of failing while TanStack Query still assumes it is online.
if (typeof navigator !== 'undefined') onlineManager.setOnline(navigator.onLine);
