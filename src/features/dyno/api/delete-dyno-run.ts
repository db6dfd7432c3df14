import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { invalidateDyno } from './keys';

export function deleteDynoRun({ buildId, runId }: { buildId: string; runId: string }) {
  return api.delete(
    `/api/builds/${encodeURIComponent(buildId)}/dyno-runs/${encodeURIComponent(runId)}`,
  );
}

export const useDeleteDynoRun = () => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: deleteDynoRun,
    onSuccess: (_r, { buildId }) => invalidateDyno(queryClient, buildId),
  });
};
