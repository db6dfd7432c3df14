import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { CalendarFeed } from '@shared/schemas/timeline';
import { api } from '@/lib/api-client';
import { getCalendarFeedQueryOptions } from './get-calendar-feed';
import { timelineBase } from './get-timeline';

/** A new calendar link for me; an earlier one stops working. The answer holds the address. */
export async function createCalendarFeed({ buildId }: { buildId: string }): Promise<CalendarFeed> {
  const data = await api.post<{ feed: CalendarFeed }>(`${timelineBase(buildId)}/calendar-feed`);
  return data.feed;
}

export const useCreateCalendarFeed = () => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createCalendarFeed,
    onSuccess: (feed, { buildId }) =>
      queryClient.setQueryData(getCalendarFeedQueryOptions(buildId).queryKey, feed),
  });
};
