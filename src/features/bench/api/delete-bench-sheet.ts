import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { getBenchSheetQueryOptions } from './get-bench-sheet';
import { invalidateBench } from './invalidate';
import { benchSheetUrl } from './paths';

export function deleteBenchSheet({ buildId, sheetId }: { buildId: string; sheetId: string }) {
  return api.delete(benchSheetUrl(buildId, sheetId));
}

export const useDeleteBenchSheet = () => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: deleteBenchSheet,
    onSuccess: async (_done, { buildId, sheetId }) => {
      // The sheet's own page must not refetch a sheet that is gone.
      queryClient.removeQueries({ queryKey: getBenchSheetQueryOptions(buildId, sheetId).queryKey });
      await invalidateBench(queryClient, buildId);
    },
  });
};
