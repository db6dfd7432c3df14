import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import type { EstimateRequestInput, EstimateResult } from '@shared/schemas/estimate';
import { api } from '@/lib/api-client';

/** POST /api/estimate: the stateless estimate, open without sign-in. */
export async function postEstimate(
  input: EstimateRequestInput,
  signal?: AbortSignal,
): Promise<EstimateResult> {
  const data = await api.post<{ estimate: EstimateResult }>('/api/estimate', input, { signal });
  return data.estimate;
}

export const getStatelessEstimateQueryOptions = (input: EstimateRequestInput | null) =>
  queryOptions({
    queryKey: ['estimate', 'stateless', input] as const,
    queryFn: ({ signal }) => postEstimate(input!, signal),
    enabled: input !== null,
    // The same request always gets the same answer.
    staleTime: Infinity,
    placeholderData: keepPreviousData,
  });

/** Pass null while there is nothing valid to send. */
export const useStatelessEstimate = (input: EstimateRequestInput | null) =>
  useQuery(getStatelessEstimateQueryOptions(input));
