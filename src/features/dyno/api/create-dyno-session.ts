import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { CreateDynoSessionInput, DynoSession } from '@shared/schemas/dyno';
import { api } from '@/lib/api-client';
import { invalidateDyno } from './keys';

export async function createDynoSession({
  buildId,
  input,
}: {
  buildId: string;
  input: CreateDynoSessionInput;
}): Promise<DynoSession> {
  const data = await api.post<{ session: DynoSession }>(
    `/api/builds/${encodeURIComponent(buildId)}/dyno-sessions`,
    input,
  );
  return data.session;
}

export const useCreateDynoSession = () => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createDynoSession,
    onSuccess: (_s, { buildId }) => invalidateDyno(queryClient, buildId),
  });
};
