import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { Step } from '@shared/schemas/install-log';
import { api } from '@/lib/api-client';
import { invalidateInstallLog, setCachedStep } from './invalidate';
import { installBase, seg } from './paths';

/** Owner only: takes a signed-off step back to "under way" so it can change again. */
export async function reopenStep({
  buildId,
  stepId,
}: {
  buildId: string;
  stepId: string;
}): Promise<Step> {
  const data = await api.delete<{ step: Step }>(
    `${installBase(buildId)}/steps/${seg(stepId)}/sign-off`,
  );
  return data.step;
}

export const useReopenStep = () => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: reopenStep,
    onSuccess: async (step, { buildId }) => {
      setCachedStep(queryClient, step);
      await invalidateInstallLog(queryClient, buildId);
    },
  });
};
