import { queryOptions, useQuery } from '@tanstack/react-query';
import type { Timeline } from '@shared/schemas/timeline';
import { api } from '@/lib/api-client';

export const timelineBase = (buildId: string) => `/api/builds/${encodeURIComponent(buildId)}`;

/** The build's timeline as I may see it: countdown, threats and dated items, counted on the server. */
export async function getTimeline(buildId: string, signal?: AbortSignal): Promise<Timeline> {
  const data = await api.get<{ timeline: Timeline }>(`${timelineBase(buildId)}/timeline`, {
    signal,
  });
  return data.timeline;
}

export const getTimelineQueryOptions = (buildId: string) =>
  queryOptions({
    queryKey: ['builds', buildId, 'timeline'] as const,
    queryFn: ({ signal }) => getTimeline(buildId, signal),
    // Made from parts, jobs and milestones that other pages change: read afresh on each visit.
    staleTime: 0,
  });

export const useTimeline = (buildId: string) => useQuery(getTimelineQueryOptions(buildId));
