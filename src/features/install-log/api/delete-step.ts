import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { invalidateInstallLog } from './invalidate';
import { installBase, seg } from './paths';

/** Owner only: removes a step with its checklist, specs, readings and photos. */
export async function deleteStep({
  buildId,
  stepId,
}: {
  buildId: string;
  stepId: string;
}): Promise<void> {
  await api.delete(`${installBase(buildId)}/steps/${seg(stepId)}`);
}

export const useDeleteStep = () => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: deleteStep,
    // The step itself is not refetched: it is gone, and its page navigates away.
    onSuccess: (_data, { buildId }) => invalidateInstallLog(queryClient, buildId),
  });
};
