import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { BenchSheetAnswer, CreateBenchSheetInput } from '@shared/schemas/bench';
import { api } from '@/lib/api-client';
import { invalidateBench } from './invalidate';
import { benchSheetsUrl } from './paths';

export function createBenchSheet({
  buildId,
  input,
}: {
  buildId: string;
  input: CreateBenchSheetInput;
}): Promise<BenchSheetAnswer> {
  return api.post<BenchSheetAnswer>(benchSheetsUrl(buildId), input);
}

export const useCreateBenchSheet = () => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createBenchSheet,
    onSuccess: (_answer, { buildId }) => invalidateBench(queryClient, buildId),
  });
};
