import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { Step, UpdateStepInput } from '@shared/schemas/install-log';
import { api } from '@/lib/api-client';
import { invalidateInstallLog, setCachedStep } from './invalidate';
import { installBase, seg } from './paths';

export async function updateStep({
  buildId,
  stepId,
  input,
}: {
  buildId: string;
  stepId: string;
  input: UpdateStepInput;
}): Promise<Step> {
  const data = await api.patch<{ step: Step }>(
    `${installBase(buildId)}/steps/${seg(stepId)}`,
    input,
  );
  return data.step;
}

export const useUpdateStep = () => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateStep,
    onSuccess: async (step, { buildId }) => {
      setCachedStep(queryClient, step);
      await invalidateInstallLog(queryClient, buildId);
    },
  });
};
