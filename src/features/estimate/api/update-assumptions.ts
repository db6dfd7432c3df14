import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { AssumptionsInput, AssumptionsResponse } from '@shared/schemas/estimate';
import { apiRequest } from '@/lib/api-client';
import { getAssumptionsQueryOptions } from './get-assumptions';
import { getEstimateQueryOptions } from './get-estimate';

/** Replaces the build's assumptions; fields left out take their defaults (so `{}` resets them). */
export async function updateAssumptions({
  buildId,
  input,
}: {
  buildId: string;
  input: AssumptionsInput;
}): Promise<AssumptionsResponse> {
  return apiRequest<AssumptionsResponse>(`/api/builds/${encodeURIComponent(buildId)}/assumptions`, {
    method: 'PUT',
    body: input,
  });
}

export const useUpdateAssumptions = () => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateAssumptions,
    onSuccess: async (data, { buildId }) => {
      queryClient.setQueryData(getAssumptionsQueryOptions(buildId).queryKey, data);
      await queryClient.invalidateQueries({ queryKey: getEstimateQueryOptions(buildId).queryKey });
    },
  });
};
