import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { invalidateBench } from './invalidate';
import { benchSheetUrl } from './paths';

export function deleteBenchOriginal({ buildId, sheetId }: { buildId: string; sheetId: string }) {
  return api.delete(`${benchSheetUrl(buildId, sheetId)}/original`);
}

export const useDeleteBenchOriginal = () => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: deleteBenchOriginal,
    onSuccess: (_done, { buildId }) => invalidateBench(queryClient, buildId),
  });
};
