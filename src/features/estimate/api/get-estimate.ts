import { queryOptions, useQuery } from '@tanstack/react-query';
import type { EstimateResult } from '@shared/schemas/estimate';
import { api } from '@/lib/api-client';

export async function getEstimate(buildId: string, signal?: AbortSignal): Promise<EstimateResult> {
  const data = await api.get<{ estimate: EstimateResult }>(
    `/api/builds/${encodeURIComponent(buildId)}/estimate`,
    { signal },
  );
  return data.estimate;
}

export const getEstimateQueryOptions = (buildId: string) =>
  queryOptions({
    queryKey: ['builds', buildId, 'estimate'] as const,
    queryFn: ({ signal }) => getEstimate(buildId, signal),
    // The estimate follows the parts ledger and the build's target, which other pages change
    // without knowing about this query: always check again when the page opens.
    staleTime: 0,
  });

export const useEstimate = (buildId: string) => useQuery(getEstimateQueryOptions(buildId));
