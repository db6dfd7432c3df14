import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { CreatePartInput } from '@shared/schemas/parts';
import { uploadFile } from '@/lib/upload';
import { invalidateLedger } from './invalidate';

export type ImportResult = { dryRun: boolean; saved: number; rows: CreatePartInput[] };

/**
 * Uploads a CSV of parts. With dryRun the server only checks every row and answers with
 * what it would save; without it, it saves all rows or none.
 * A refusal is an `UploadError`, with `rows` when individual rows need fixing.
 */
export async function importParts({
  buildId,
  file,
  dryRun,
}: {
  buildId: string;
  file: File;
  dryRun: boolean;
}): Promise<ImportResult> {
  const body = new FormData();
  body.append('file', file);
  const url = `/api/builds/${encodeURIComponent(buildId)}/parts/import${dryRun ? '?dryRun=1' : ''}`;
  return uploadFile('POST', url, body);
}

export const useImportParts = () => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: importParts,
    onSuccess: async (result, { buildId }) => {
      if (!result.dryRun) await invalidateLedger(queryClient, buildId);
    },
  });
};
