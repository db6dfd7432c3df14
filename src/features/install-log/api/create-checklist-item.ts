import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { ChecklistItem, CreateChecklistItemInput } from '@shared/schemas/install-log';
import { api } from '@/lib/api-client';
import { invalidateInstallLog } from './invalidate';
import { installBase, seg } from './paths';

export async function createChecklistItem({
  buildId,
  stepId,
  input,
}: {
  buildId: string;
  stepId: string;
  input: CreateChecklistItemInput;
}): Promise<ChecklistItem> {
  const data = await api.post<{ item: ChecklistItem }>(
    `${installBase(buildId)}/steps/${seg(stepId)}/checklist`,
    input,
  );
  return data.item;
}

export const useCreateChecklistItem = () => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createChecklistItem,
    onSuccess: (_item, { buildId, stepId }) => invalidateInstallLog(queryClient, buildId, stepId),
  });
};
