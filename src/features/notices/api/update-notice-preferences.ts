import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { NoticePreferences, NoticePreferencesInput } from '@shared/schemas/notices';
import { apiRequest } from '@/lib/api-client';
import { getNoticePreferencesQueryOptions } from './get-notice-preferences';

/** Replaces my whole set of choices on the build; the answer is the set as stored. */
export async function updateNoticePreferences({
  buildId,
  input,
}: {
  buildId: string;
  input: NoticePreferencesInput;
}): Promise<NoticePreferences> {
  const data = await apiRequest<{ preferences: NoticePreferences }>(
    `/api/builds/${encodeURIComponent(buildId)}/notice-preferences`,
    { method: 'PUT', body: input },
  );
  return data.preferences;
}

export const useUpdateNoticePreferences = () => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateNoticePreferences,
    onSuccess: (preferences, { buildId }) => {
      queryClient.setQueryData(getNoticePreferencesQueryOptions(buildId).queryKey, preferences);
    },
  });
};
