import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { Timeline, TimelineSettingsInput } from '@shared/schemas/timeline';
import { api } from '@/lib/api-client';
import { getBuildQueryOptions } from '@/features/builds/api/get-build';
import { getTimelineQueryOptions, timelineBase } from './get-timeline';

/** The owner's buffer, pace and the build's time zone; the answer is the timeline recounted. */
export async function updateTimelineSettings({
  buildId,
  input,
}: {
  buildId: string;
  input: TimelineSettingsInput;
}): Promise<Timeline> {
  const data = await api.patch<{ timeline: Timeline }>(
    `${timelineBase(buildId)}/timeline/settings`,
    input,
  );
  return data.timeline;
}

export const useUpdateTimelineSettings = () => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateTimelineSettings,
    onSuccess: async (timeline, { buildId, input }) => {
      queryClient.setQueryData(getTimelineQueryOptions(buildId).queryKey, timeline);
      // The build carries its time zone (the countdown badges count in it).
      if (input.timeZone !== undefined) {
        await queryClient.invalidateQueries({ queryKey: getBuildQueryOptions(buildId).queryKey });
      }
    },
  });
};
