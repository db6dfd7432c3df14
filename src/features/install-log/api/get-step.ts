import { queryOptions, useQuery } from '@tanstack/react-query';
import type { Step } from '@shared/schemas/install-log';
import { api } from '@/lib/api-client';
import { installBase, seg } from './paths';

export async function getStep(buildId: string, stepId: string, signal?: AbortSignal) {
  const data = await api.get<{ step: Step }>(`${installBase(buildId)}/steps/${seg(stepId)}`, {
    signal,
  });
  return data.step;
}

export const getStepQueryOptions = (buildId: string, stepId: string) =>
  queryOptions({
    queryKey: ['builds', buildId, 'install', 'steps', stepId] as const,
    queryFn: ({ signal }) => getStep(buildId, stepId, signal),
  });

export const useStep = (buildId: string, stepId: string) =>
  useQuery(getStepQueryOptions(buildId, stepId));
