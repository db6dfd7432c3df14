import { queryOptions, useQuery } from '@tanstack/react-query';
import type { Job } from '@shared/schemas/install-log';
import { api } from '@/lib/api-client';
import { installBase } from './paths';

export async function getJobs(buildId: string, signal?: AbortSignal): Promise<Job[]> {
  const data = await api.get<{ jobs: Job[] }>(`${installBase(buildId)}/jobs`, { signal });
  return data.jobs;
}

export const getJobsQueryOptions = (buildId: string) =>
  queryOptions({
    queryKey: ['builds', buildId, 'install', 'jobs'] as const,
    queryFn: ({ signal }) => getJobs(buildId, signal),
  });

export const useJobs = (buildId: string) => useQuery(getJobsQueryOptions(buildId));
