import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { DynoRun, ImportDynoRunFields } from '@shared/schemas/dyno';
import { dynoFileField } from '@shared/schemas/dyno';
import { invalidateDyno } from './keys';
import { uploadFile } from '@/lib/upload';

export type ImportDynoRunResult = { dryRun: false; run: DynoRun; reordered: boolean };

/**
 * A new run from a curve CSV and the run's other fields. The page has already read the
 * file with the same parser and shown its rows; the server reads it again and saves the
 * run with its curve, or nothing.
 */
export function importDynoRun({
  buildId,
  sessionId,
  file,
  fields,
}: {
  buildId: string;
  sessionId: string;
  file: File;
  fields: ImportDynoRunFields;
}): Promise<ImportDynoRunResult> {
  const body = new FormData();
  body.append('run', JSON.stringify(fields));
  body.append(dynoFileField, file, file.name);
  return uploadFile(
    'POST',
    `/api/builds/${encodeURIComponent(buildId)}/dyno-sessions/${encodeURIComponent(sessionId)}/runs/import`,
    body,
  );
}

export const useImportDynoRun = () => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: importDynoRun,
    onSuccess: (_r, { buildId }) => invalidateDyno(queryClient, buildId),
  });
};
