import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { invalidateInstallLog } from './invalidate';
import { installBase, seg } from './paths';

/** Owner only: removes a fastener spec with its readings. */
export async function deleteFastener({
  buildId,
  specId,
}: {
  buildId: string;
  stepId: string;
  specId: string;
}): Promise<void> {
  await api.delete(`${installBase(buildId)}/fasteners/${seg(specId)}`);
}

export const useDeleteFastener = () => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: deleteFastener,
    onSuccess: (_data, { buildId, stepId }) => invalidateInstallLog(queryClient, buildId, stepId),
  });
};
