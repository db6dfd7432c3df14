import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { CloseRetorqueInput, RetorqueCheck } from '@shared/schemas/install-log';
import { api } from '@/lib/api-client';
import { invalidateInstallLog } from './invalidate';
import { installBase, seg } from './paths';

/** Closes an open re-torque check by hand, with a note saying how it was re-checked. */
export async function closeRetorqueCheck({
  buildId,
  specId,
  input,
}: {
  buildId: string;
  specId: string;
  input: CloseRetorqueInput;
}): Promise<RetorqueCheck> {
  const data = await api.post<{ check: RetorqueCheck }>(
    `${installBase(buildId)}/retorque-checks/${seg(specId)}/close`,
    input,
  );
  return data.check;
}

export const useCloseRetorqueCheck = () => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: closeRetorqueCheck,
    onSuccess: (check, { buildId }) => invalidateInstallLog(queryClient, buildId, check.stepId),
  });
};
