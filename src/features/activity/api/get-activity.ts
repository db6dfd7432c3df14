import { queryOptions, useQuery } from '@tanstack/react-query';
import type { ActivityEvent } from '@shared/schemas/activity';
import { api } from '@/lib/api-client';

/** What has happened lately on the build, newest first, as my role may see it. */
export async function getActivity(buildId: string, signal?: AbortSignal): Promise<ActivityEvent[]> {
  const data = await api.get<{ events: ActivityEvent[] }>(
    `/api/builds/${encodeURIComponent(buildId)}/activity`,
    { signal },
  );
  return data.events;
}

export const getActivityQueryOptions = (buildId: string) =>
  queryOptions({
    queryKey: ['builds', buildId, 'activity'] as const,
    queryFn: ({ signal }) => getActivity(buildId, signal),
  });

export const useActivity = (buildId: string) => useQuery(getActivityQueryOptions(buildId));
