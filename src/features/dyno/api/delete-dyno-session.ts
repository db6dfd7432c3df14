import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { dynoKey, invalidateDyno } from './keys';

export function deleteDynoSession({ buildId, sessionId }: { buildId: string; sessionId: string }) {
  return api.delete(
    `/api/builds/${encodeURIComponent(buildId)}/dyno-sessions/${encodeURIComponent(sessionId)}`,
  );
}

export const useDeleteDynoSession = () => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: deleteDynoSession,
    onSuccess: async (_r, { buildId, sessionId }) => {
      // The page of a deleted session must not refetch into a 404 while it navigates away.
      queryClient.removeQueries({ queryKey: [...dynoKey(buildId), 'session', sessionId] });
      await invalidateDyno(queryClient, buildId);
    },
  });
};
