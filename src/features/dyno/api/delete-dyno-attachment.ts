import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { invalidateDyno } from './keys';

export function deleteDynoAttachment({ buildId, runId }: { buildId: string; runId: string }) {
  return api.delete(
    `/api/builds/${encodeURIComponent(buildId)}/dyno-runs/${encodeURIComponent(runId)}/attachment`,
  );
}

export const useDeleteDynoAttachment = () => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: deleteDynoAttachment,
    onSuccess: (_r, { buildId }) => invalidateDyno(queryClient, buildId),
  });
};
