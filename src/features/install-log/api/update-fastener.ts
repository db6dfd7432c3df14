import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { FastenerSpec, UpdateFastenerSpecInput } from '@shared/schemas/install-log';
import { api } from '@/lib/api-client';
import { invalidateInstallLog, setCachedFastener } from './invalidate';
import { installBase, seg } from './paths';

/**
 * Owner and crew, while the step is open. Once a spec has readings, only the owner may
 * change its target or tolerance (the server answers 403 to anyone else).
 */
export async function updateFastener({
  buildId,
  specId,
  input,
}: {
  buildId: string;
  specId: string;
  input: UpdateFastenerSpecInput;
}): Promise<FastenerSpec> {
  const data = await api.patch<{ fastener: FastenerSpec }>(
    `${installBase(buildId)}/fasteners/${seg(specId)}`,
    input,
  );
  return data.fastener;
}

export const useUpdateFastener = () => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateFastener,
    onSuccess: async (fastener, { buildId }) => {
      setCachedFastener(queryClient, buildId, fastener);
      // Verdicts, blockers and re-torque checks may all move with a changed spec.
      await invalidateInstallLog(queryClient, buildId, fastener.stepId);
    },
  });
};
