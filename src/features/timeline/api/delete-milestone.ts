import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { getTimelineQueryOptions, timelineBase } from './get-timeline';

export async function deleteMilestone({
  buildId,
  milestoneId,
}: {
  buildId: string;
  milestoneId: string;
}): Promise<void> {
  await api.delete(`${timelineBase(buildId)}/milestones/${encodeURIComponent(milestoneId)}`);
}

export const useDeleteMilestone = () => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: deleteMilestone,
    onSuccess: (_r, { buildId }) =>
      queryClient.invalidateQueries({ queryKey: getTimelineQueryOptions(buildId).queryKey }),
  });
};
