import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { getCalendarFeedQueryOptions } from './get-calendar-feed';
import { timelineBase } from './get-timeline';

/** Stops my calendar link: the calendar that subscribed gets nothing more. */
export async function deleteCalendarFeed({ buildId }: { buildId: string }): Promise<void> {
  await api.delete(`${timelineBase(buildId)}/calendar-feed`);
}

export const useDeleteCalendarFeed = () => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: deleteCalendarFeed,
    onSuccess: (_r, { buildId }) =>
      queryClient.setQueryData(getCalendarFeedQueryOptions(buildId).queryKey, null),
  });
};
