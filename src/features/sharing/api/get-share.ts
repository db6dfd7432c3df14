import { queryOptions, useQuery } from '@tanstack/react-query';
import type { ShareSettings } from '@shared/schemas/sharing';
import { api } from '@/lib/api-client';

export const sharePath = (buildId: string) => `/api/builds/${encodeURIComponent(buildId)}/share`;

/** The owner's sharing settings of a build. */
export async function getShare(buildId: string, signal?: AbortSignal): Promise<ShareSettings> {
  const data = await api.get<{ share: ShareSettings }>(sharePath(buildId), { signal });
  return data.share;
}

export const getShareQueryOptions = (buildId: string) =>
  queryOptions({
    queryKey: ['builds', buildId, 'share'] as const,
    queryFn: ({ signal }) => getShare(buildId, signal),
  });

export const useShare = (buildId: string) => useQuery(getShareQueryOptions(buildId));
