import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { DynoRun, UpdateDynoRunInput } from '@shared/schemas/dyno';
import { api } from '@/lib/api-client';
import { invalidateDyno } from './keys';

export async function updateDynoRun({
  buildId,
  runId,
  input,
}: {
  buildId: string;
  runId: string;
  input: UpdateDynoRunInput;
}): Promise<DynoRun> {
  const data = await api.patch<{ run: DynoRun }>(
    `/api/builds/${encodeURIComponent(buildId)}/dyno-runs/${encodeURIComponent(runId)}`,
    input,
  );
  return data.run;
}

export const useUpdateDynoRun = () => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateDynoRun,
    onSuccess: (_r, { buildId }) => invalidateDyno(queryClient, buildId),
  });
};
