import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { CreateDynoRunInput, DynoRun } from '@shared/schemas/dyno';
import { api } from '@/lib/api-client';
import { invalidateDyno } from './keys';

export async function createDynoRun({
  buildId,
  sessionId,
  input,
}: {
  buildId: string;
  sessionId: string;
  input: CreateDynoRunInput;
}): Promise<DynoRun> {
  const data = await api.post<{ run: DynoRun }>(
    `/api/builds/${encodeURIComponent(buildId)}/dyno-sessions/${encodeURIComponent(sessionId)}/runs`,
    input,
  );
  return data.run;
}

export const useCreateDynoRun = () => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createDynoRun,
    onSuccess: (_r, { buildId }) => invalidateDyno(queryClient, buildId),
  });
};
