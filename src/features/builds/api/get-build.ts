import { queryOptions, useQuery } from '@tanstack/react-query';
import type { Build } from '@shared/schemas/builds';
import { api } from '@/lib/api-client';

export async function getBuild(buildId: string, signal?: AbortSignal): Promise<Build> {
  const data = await api.get<{ build: Build }>(`/api/builds/${encodeURIComponent(buildId)}`, {
    signal,
  });
  return data.build;
}

export const getBuildQueryOptions = (buildId: string) =>
  queryOptions({
    queryKey: ['builds', buildId] as const,
    queryFn: ({ signal }) => getBuild(buildId, signal),
  });

export const useBuild = (buildId: string) => useQuery(getBuildQueryOptions(buildId));
