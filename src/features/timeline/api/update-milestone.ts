import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { Milestone, UpdateMilestoneInput } from '../../../../shared/schemas/timeline';
import { api } from '../../../lib/api-client';
import { getTimelineQueryOptions, timelineBase } from './get-timeline';

export async function updateMilestone({
  buildId,
  milestoneId,
  input,
}: {
  buildId: string;
  milestoneId: string;
  input: UpdateMilestoneInput;
}): Promise<Milestone> {
  const data = await api.patch<{ milestone: Milestone }>(
    `${timelineBase(buildId)}/milestones/${encodeURIComponent(milestoneId)}`,
    input,
  );
  return data.milestone;
}

export const useUpdateMilestone = () => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateMilestone,
    onSuccess: (_m, { buildId }) =>
      queryClient.invalidateQueries({ queryKey: getTimelineQueryOptions(buildId).queryKey }),
  });
};
