import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { invalidateInstallLog } from './invalidate';
import { installBase, seg } from './paths';

export async function deleteChecklistItem({
  buildId,
  itemId,
}: {
  buildId: string;
  stepId: string;
  itemId: string;
}): Promise<void> {
  await api.delete(`${installBase(buildId)}/checklist/${seg(itemId)}`);
}

export const useDeleteChecklistItem = () => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: deleteChecklistItem,
    onSuccess: (_data, { buildId, stepId }) => invalidateInstallLog(queryClient, buildId, stepId),
  });
};
