import { queryOptions, useQuery } from '@tanstack/react-query';
import type { Build } from '@shared/schemas/builds';
import { api } from '@/lib/api-client';

export async function getBuilds(signal?: AbortSignal): Promise<Build[]> {
  const data = await api.get<{ builds: Build[] }>('/api/builds', { signal });
  return data.builds;
}

export const getBuildsQueryOptions = () =>
  queryOptions({
    queryKey: ['builds'] as const,
    queryFn: ({ signal }) => getBuilds(signal),
  });

export const useBuilds = () => useQuery(getBuildsQueryOptions());
