import { useMutation, useQueryClient } from '@tanstack/react-query';
import type {
  ChecklistItem,
  UpdateChecklistItemInput,
} from '../../../../shared/schemas/install-log';
import { api } from '../../../lib/api-client';
import { getStepQueryOptions } from './get-step';
import { invalidateInstallLog } from './invalidate';
import { installBase, seg } from './paths';

export async function updateChecklistItem({
  buildId,
  itemId,
  input,
}: {
  buildId: string;
  stepId: string;
  itemId: string;
  input: UpdateChecklistItemInput;
}): Promise<ChecklistItem> {
  const data = await api.patch<{ item: ChecklistItem }>(
    `${installBase(buildId)}/checklist/${seg(itemId)}`,
    input,
  );
  return data.item;
}

export const useUpdateChecklistItem = () => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateChecklistItem,
    onSuccess: async (item, { buildId, stepId }) => {
      // The tick (with who and when) shows at once; counts and blockers follow from the refetch.
      queryClient.setQueryData(getStepQueryOptions(buildId, stepId).queryKey, (step) =>
        step
          ? { ...step, checklist: step.checklist.map((c) => (c.id === item.id ? item : c)) }
          : step,
      );
      await invalidateInstallLog(queryClient, buildId, stepId);
    },
    onError: (_error, { buildId, stepId }) => invalidateInstallLog(queryClient, buildId, stepId),
  });
};
