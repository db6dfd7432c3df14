import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { DynoSession, UpdateDynoSessionInput } from '@shared/schemas/dyno';
import { api } from '@/lib/api-client';
import { invalidateDyno } from './keys';

export async function updateDynoSession({
  buildId,
  sessionId,
  input,
}: {
  buildId: string;
  sessionId: string;
  input: UpdateDynoSessionInput;
}): Promise<DynoSession> {
  const data = await api.patch<{ session: DynoSession }>(
    `/api/builds/${encodeURIComponent(buildId)}/dyno-sessions/${encodeURIComponent(sessionId)}`,
    input,
  );
  return data.session;
}

export const useUpdateDynoSession = () => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateDynoSession,
    onSuccess: (_s, { buildId }) => invalidateDyno(queryClient, buildId),
  });
};
