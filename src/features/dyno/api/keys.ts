import type { QueryClient } from '@tanstack/react-query';

/** Every dyno query of a build starts with this key, so one write can refresh them all. */
export const dynoKey = (buildId: string) => ['builds', buildId, 'dyno'] as const;

/** After any dyno write: the lists, the summaries and every session page of the build. */
export const invalidateDyno = (queryClient: QueryClient, buildId: string) =>
  queryClient.invalidateQueries({ queryKey: dynoKey(buildId) });
