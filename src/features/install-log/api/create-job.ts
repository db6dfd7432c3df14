import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { CreateJobInput, Job } from '@shared/schemas/install-log';
import { api } from '@/lib/api-client';
import { invalidateInstallLog } from './invalidate';
import { installBase } from './paths';

export async function createJob({
  buildId,
  input,
}: {
  buildId: string;
  input: CreateJobInput;
}): Promise<Job> {
  const data = await api.post<{ job: Job }>(`${installBase(buildId)}/jobs`, input);
  return data.job;
}

export const useCreateJob = () => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createJob,
    onSuccess: (_job, { buildId }) => invalidateInstallLog(queryClient, buildId),
  });
};
