import { queryOptions, useQuery } from '@tanstack/react-query';
import type { NoticePreferences } from '@shared/schemas/notices';
import { api } from '@/lib/api-client';

/** My own choice of notices on one build: every kind, on or off. */
export async function getNoticePreferences(
  buildId: string,
  signal?: AbortSignal,
): Promise<NoticePreferences> {
  const data = await api.get<{ preferences: NoticePreferences }>(
    `/api/builds/${encodeURIComponent(buildId)}/notice-preferences`,
    { signal },
  );
  return data.preferences;
}

export const getNoticePreferencesQueryOptions = (buildId: string) =>
  queryOptions({
    queryKey: ['builds', buildId, 'notice-preferences'] as const,
    queryFn: ({ signal }) => getNoticePreferences(buildId, signal),
  });

export const useNoticePreferences = (buildId: string) =>
  useQuery(getNoticePreferencesQueryOptions(buildId));
