import { useMutation, useQueryClient } from '@tanstack/react-query';
import { dynoFileField, type DynoRun } from '@shared/schemas/dyno';
import { invalidateDyno } from './keys';
import { uploadFile } from '@/lib/upload';

/** Replaces a run's curve with a CSV's; the run takes the file's units (typed figures are converted). */
export function replaceDynoCurve({
  buildId,
  runId,
  file,
}: {
  buildId: string;
  runId: string;
  file: File;
}): Promise<{ dryRun: false; run: DynoRun; reordered: boolean }> {
  const body = new FormData();
  body.append(dynoFileField, file, file.name);
  return uploadFile(
    'PUT',
    `/api/builds/${encodeURIComponent(buildId)}/dyno-runs/${encodeURIComponent(runId)}/curve.csv`,
    body,
  );
}

export const useReplaceDynoCurve = () => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: replaceDynoCurve,
    onSuccess: (_r, { buildId }) => invalidateDyno(queryClient, buildId),
  });
};
