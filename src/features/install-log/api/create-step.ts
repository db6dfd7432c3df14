import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { CreateStepInput, Step } from '@shared/schemas/install-log';
import { api } from '@/lib/api-client';
import { invalidateInstallLog, setCachedStep } from './invalidate';
import { installBase, seg } from './paths';

export async function createStep({
  buildId,
  jobId,
  input,
}: {
  buildId: string;
  jobId: string;
  input: CreateStepInput;
}): Promise<Step> {
  const data = await api.post<{ step: Step }>(
    `${installBase(buildId)}/jobs/${seg(jobId)}/steps`,
    input,
  );
  return data.step;
}

export const useCreateStep = () => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createStep,
    onSuccess: async (step, { buildId }) => {
      setCachedStep(queryClient, step);
      await invalidateInstallLog(queryClient, buildId);
    },
  });
};
