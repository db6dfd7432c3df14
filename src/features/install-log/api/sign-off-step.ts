import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { SignOffInput, Step } from '@shared/schemas/install-log';
import { api } from '@/lib/api-client';
import { invalidateInstallLog, setCachedStep } from './invalidate';
import { installBase, seg } from './paths';

/** Signs a step off; an owner may pass overrideReason to sign off over blockers. */
export async function signOffStep({
  buildId,
  stepId,
  input,
}: {
  buildId: string;
  stepId: string;
  input: SignOffInput;
}): Promise<Step> {
  const data = await api.post<{ step: Step }>(
    `${installBase(buildId)}/steps/${seg(stepId)}/sign-off`,
    input,
  );
  return data.step;
}

export const useSignOffStep = () => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: signOffStep,
    onSuccess: async (step, { buildId }) => {
      setCachedStep(queryClient, step);
      await invalidateInstallLog(queryClient, buildId);
    },
    // A 409 means the step moved on the server (a new reading, a tick): show it as it is now.
    onError: (_error, { buildId, stepId }) => invalidateInstallLog(queryClient, buildId, stepId),
  });
};
