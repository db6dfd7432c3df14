import { queryOptions, useQuery } from '@tanstack/react-query';
import type { CalendarFeed } from '@shared/schemas/timeline';
import { api } from '@/lib/api-client';
import { timelineBase } from './get-timeline';

/** Whether I have a calendar link for the build, and since when (its address is shown only once). */
export async function getCalendarFeed(
  buildId: string,
  signal?: AbortSignal,
): Promise<CalendarFeed | null> {
  const data = await api.get<{ feed: CalendarFeed | null }>(
    `${timelineBase(buildId)}/calendar-feed`,
    { signal },
  );
  return data.feed;
}

export const getCalendarFeedQueryOptions = (buildId: string) =>
  queryOptions({
    queryKey: ['builds', buildId, 'calendar-feed'] as const,
    queryFn: ({ signal }) => getCalendarFeed(buildId, signal),
  });

export const useCalendarFeed = (buildId: string) => useQuery(getCalendarFeedQueryOptions(buildId));
