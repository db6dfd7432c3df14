import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { Job, UpdateJobInput } from '@shared/schemas/install-log';
import { api } from '@/lib/api-client';
import { invalidateInstallLog } from './invalidate';
import { installBase, seg } from './paths';

/** Owner and crew: renames a job or changes its notes. */
export async function updateJob({
  buildId,
  jobId,
  input,
}: {
  buildId: string;
  jobId: string;
  input: UpdateJobInput;
}): Promise<Job> {
  const data = await api.patch<{ job: Job }>(`${installBase(buildId)}/jobs/${seg(jobId)}`, input);
  return data.job;
}

export const useUpdateJob = () => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateJob,
    onSuccess: (_job, { buildId }) => invalidateInstallLog(queryClient, buildId),
  });
};
