import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { getPartsQueryOptions } from './get-parts';
import { invalidateLedger } from './invalidate';

export async function deletePart({
  buildId,
  partId,
}: {
  buildId: string;
  partId: string;
}): Promise<void> {
  await api.delete(
    `/api/builds/${encodeURIComponent(buildId)}/parts/${encodeURIComponent(partId)}`,
  );
}

export const useDeletePart = () => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: deletePart,
    onSuccess: async (_data, { buildId, partId }) => {
      queryClient.setQueryData(getPartsQueryOptions(buildId).queryKey, (parts) =>
        parts?.filter((p) => p.id !== partId),
      );
      await invalidateLedger(queryClient, buildId);
    },
  });
};
