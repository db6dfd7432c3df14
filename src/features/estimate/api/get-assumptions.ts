import { queryOptions, useQuery } from '@tanstack/react-query';
import type { AssumptionsResponse } from '@shared/schemas/estimate';
import { api } from '@/lib/api-client';

export async function getAssumptions(
  buildId: string,
  signal?: AbortSignal,
): Promise<AssumptionsResponse> {
  return api.get<AssumptionsResponse>(`/api/builds/${encodeURIComponent(buildId)}/assumptions`, {
    signal,
  });
}

export const getAssumptionsQueryOptions = (buildId: string) =>
  queryOptions({
    queryKey: ['builds', buildId, 'assumptions'] as const,
    queryFn: ({ signal }) => getAssumptions(buildId, signal),
  });

export const useAssumptions = (buildId: string) => useQuery(getAssumptionsQueryOptions(buildId));
