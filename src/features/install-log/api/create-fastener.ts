import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { CreateFastenerSpecInput, FastenerSpec } from '@shared/schemas/install-log';
import { api } from '@/lib/api-client';
import { invalidateInstallLog } from './invalidate';
import { installBase, seg } from './paths';

export async function createFastener({
  buildId,
  stepId,
  input,
}: {
  buildId: string;
  stepId: string;
  input: CreateFastenerSpecInput;
}): Promise<FastenerSpec> {
  const data = await api.post<{ fastener: FastenerSpec }>(
    `${installBase(buildId)}/steps/${seg(stepId)}/fasteners`,
    input,
  );
  return data.fastener;
}

export const useCreateFastener = () => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createFastener,
    onSuccess: (_f, { buildId, stepId }) => invalidateInstallLog(queryClient, buildId, stepId),
  });
};
