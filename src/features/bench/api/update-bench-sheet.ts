import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { BenchSheetAnswer, UpdateBenchSheetInput } from '@shared/schemas/bench';
import { api } from '@/lib/api-client';
import { getBenchSheetQueryOptions } from './get-bench-sheet';
import { invalidateBench } from './invalidate';
import { benchSheetUrl } from './paths';

export function updateBenchSheet({
  buildId,
  sheetId,
  input,
}: {
  buildId: string;
  sheetId: string;
  input: UpdateBenchSheetInput;
}): Promise<BenchSheetAnswer> {
  return api.patch<BenchSheetAnswer>(benchSheetUrl(buildId, sheetId), input);
}

export const useUpdateBenchSheet = () => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateBenchSheet,
    onSuccess: async (answer, { buildId, sheetId }) => {
      queryClient.setQueryData(getBenchSheetQueryOptions(buildId, sheetId).queryKey, answer);
      await invalidateBench(queryClient, buildId);
    },
  });
};
