import { useMutation, useQueryClient } from '@tanstack/react-query';
import { dynoFileField, type DynoRun } from '@shared/schemas/dyno';
import { invalidateDyno } from './keys';
import { uploadFile } from '@/lib/upload';

/** Puts the dyno's own file or a photo of its printout on a run (it replaces any before it). */
export async function uploadDynoAttachment({
  buildId,
  runId,
  file,
}: {
  buildId: string;
  runId: string;
  file: File;
}): Promise<DynoRun> {
  const body = new FormData();
  body.append(dynoFileField, file, file.name);
  const data = await uploadFile<{ run: DynoRun }>(
    'PUT',
    `/api/builds/${encodeURIComponent(buildId)}/dyno-runs/${encodeURIComponent(runId)}/attachment`,
    body,
  );
  return data.run;
}

export const useUploadDynoAttachment = () => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: uploadDynoAttachment,
    onSuccess: (_r, { buildId }) => invalidateDyno(queryClient, buildId),
  });
};
