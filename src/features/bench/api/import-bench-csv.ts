import { useMutation, useQueryClient } from '@tanstack/react-query';
import { benchUploadField, type BenchSheetAnswer } from '@shared/schemas/bench';
import { uploadFile } from '@/lib/upload';
import { getBenchSheetQueryOptions } from './get-bench-sheet';
import { invalidateBench } from './invalidate';
import { benchSheetUrl } from './paths';

export type BenchImportAnswer = BenchSheetAnswer & { dryRun: boolean; positions: number[] };

/**
 * Replaces a saved sheet's values from a CSV: one row per injector position, one column per
 * test point. The server checks every cell and saves all of them or none; a refusal is an
 * `UploadError` naming each bad cell by its row and column heading.
 */
export async function importBenchCsv({
  buildId,
  sheetId,
  file,
}: {
  buildId: string;
  sheetId: string;
  file: File;
}): Promise<BenchImportAnswer> {
  const body = new FormData();
  body.append(benchUploadField, file);
  return uploadFile('POST', `${benchSheetUrl(buildId, sheetId)}/import`, body);
}

export const useImportBenchCsv = () => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: importBenchCsv,
    onSuccess: async (answer, { buildId, sheetId }) => {
      const { dryRun: _d, positions: _p, ...sheet } = answer;
      queryClient.setQueryData(getBenchSheetQueryOptions(buildId, sheetId).queryKey, sheet);
      await invalidateBench(queryClient, buildId);
    },
  });
};
