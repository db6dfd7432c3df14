import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { Milestone, UpdateMilestoneInput } from '@shared/schemas/timeline';
import { api } from '@/lib/api-client';
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

/**
 * The tick shows at once and stays through a re-render of the list (it lives in the cached
 * timeline, not in one row's mutation state); a refused change puts the old one back.
 */
export const useUpdateMilestone = () => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateMilestone,
    onMutate: async ({ buildId, milestoneId, input }) => {
      const { queryKey } = getTimelineQueryOptions(buildId);
      await queryClient.cancelQueries({ queryKey });
      const before = queryClient.getQueryData(queryKey);
      queryClient.setQueryData(queryKey, (t) =>
        t?.milestones
          ? {
              ...t,
              milestones: t.milestones.map((m) => (m.id === milestoneId ? { ...m, ...input } : m)),
            }
          : t,
      );
      return { before };
    },
    onError: (_e, { buildId }, context) => {
      if (context?.before)
        queryClient.setQueryData(getTimelineQueryOptions(buildId).queryKey, context.before);
    },
    onSettled: (_m, _e, { buildId }) =>
      queryClient.invalidateQueries({ queryKey: getTimelineQueryOptions(buildId).queryKey }),
  });
};
