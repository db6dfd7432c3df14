import { queryOptions, useQuery } from '@tanstack/react-query';
import type { BuildView } from '@shared/schemas/sharing';
import { api } from '@/lib/api-client';

/** A shared build's public page: no session needed. */
export async function getSharedBuild(token: string, signal?: AbortSignal): Promise<BuildView> {
  const data = await api.get<{ build: BuildView }>(`/api/shared/${encodeURIComponent(token)}`, {
    signal,
  });
  return data.build;
}

export const getSharedBuildQueryOptions = (token: string) =>
  queryOptions({
    queryKey: ['shared', token] as const,
    queryFn: ({ signal }) => getSharedBuild(token, signal),
  });

export const useSharedBuild = (token: string) => useQuery(getSharedBuildQueryOptions(token));
