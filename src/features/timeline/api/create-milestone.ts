import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { CreateMilestoneInput, Milestone } from '@shared/schemas/timeline';
import { api } from '@/lib/api-client';
import { getTimelineQueryOptions, timelineBase } from './get-timeline';

export async function createMilestone({
  buildId,
  input,
}: {
  buildId: string;
  input: CreateMilestoneInput;
}): Promise<Milestone> {
  const data = await api.post<{ milestone: Milestone }>(
    `${timelineBase(buildId)}/milestones`,
    input,
  );
  return data.milestone;
}

export const useCreateMilestone = () => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createMilestone,
    onSuccess: (_m, { buildId }) =>
      queryClient.invalidateQueries({ queryKey: getTimelineQueryOptions(buildId).queryKey }),
  });
};
