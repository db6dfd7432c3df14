import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { invalidateInstallLog } from './invalidate';
import { installBase, seg } from './paths';

/** Owner only: removes a job with its steps, their checklists, specs, readings and photos. */
export async function deleteJob({
  buildId,
  jobId,
}: {
  buildId: string;
  jobId: string;
}): Promise<void> {
  await api.delete(`${installBase(buildId)}/jobs/${seg(jobId)}`);
}

export const useDeleteJob = () => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: deleteJob,
    onSuccess: (_data, { buildId }) => invalidateInstallLog(queryClient, buildId),
  });
};
