import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { ChecklistItem, UpdateChecklistItemInput } from '@shared/schemas/install-log';
import { api } from '@/lib/api-client';
import { enqueue, isOffline } from '@/lib/offline-queue';
import { getStepQueryOptions } from './get-step';
import { invalidateInstallLog } from './invalidate';
import { installBase, seg } from './paths';

/** Changes a checklist item; a tick without signal is kept on the device (null) and sent later. */
export async function updateChecklistItem({
  buildId,
  stepId,
  itemId,
  input,
  label,
}: {
  buildId: string;
  stepId: string;
  itemId: string;
  input: UpdateChecklistItemInput;
  /** The item in words, for the list of entries waiting to be sent. */
  label?: string;
}): Promise<ChecklistItem | null> {
  const path = `${installBase(buildId)}/checklist/${seg(itemId)}`;
  if (isOffline() && input.done !== undefined && Object.keys(input).length === 1) {
    const what = `${input.done ? 'Ticked' : 'Unticked'}: ${label ?? 'a checklist item'}`;
    await enqueue({
      buildId,
      stepId,
      kind: 'tick',
      method: 'PATCH',
      path,
      body: input,
      label: what,
    });
    return null;
  }
  const data = await api.patch<{ item: ChecklistItem }>(path, input);
  return data.item;
}

export const useUpdateChecklistItem = () => {
  const queryClient = useQueryClient();
  return useMutation({
    // Runs without signal too: it keeps the write on the device itself (lib/offline-queue).
    networkMode: 'always',
    mutationFn: updateChecklistItem,
    onSuccess: async (item, { buildId, stepId, itemId, input }) => {
      // The tick (with who and when) shows at once; counts and blockers follow from the refetch.
      // Kept on the device (null): the tick shows, waiting to be sent.
      const shown = (c: ChecklistItem) =>
        item ?? { ...c, done: input.done ?? c.done, doneBy: null, doneAt: null };
      queryClient.setQueryData(getStepQueryOptions(buildId, stepId).queryKey, (step) =>
        step
          ? { ...step, checklist: step.checklist.map((c) => (c.id === itemId ? shown(c) : c)) }
          : step,
      );
      if (!item) return;
      await invalidateInstallLog(queryClient, buildId, stepId);
    },
    onError: (_error, { buildId, stepId }) => invalidateInstallLog(queryClient, buildId, stepId),
  });
};
