import { queryOptions, useQuery } from '@tanstack/react-query';
import type { RetorqueCheck } from '@shared/schemas/install-log';
import { api } from '@/lib/api-client';
import { installBase } from './paths';

export type RetorqueFilter = 'open' | 'all';

export async function getRetorqueChecks(
  buildId: string,
  status: RetorqueFilter,
  signal?: AbortSignal,
): Promise<RetorqueCheck[]> {
  const data = await api.get<{ checks: RetorqueCheck[] }>(
    `${installBase(buildId)}/retorque-checks?status=${status}`,
    { signal },
  );
  return data.checks;
}

export const getRetorqueChecksQueryOptions = (buildId: string, status: RetorqueFilter = 'open') =>
  queryOptions({
    queryKey: ['builds', buildId, 'install', 'retorque-checks', status] as const,
    queryFn: ({ signal }) => getRetorqueChecks(buildId, status, signal),
  });

export const useRetorqueChecks = (buildId: string, status: RetorqueFilter = 'open') =>
  useQuery(getRetorqueChecksQueryOptions(buildId, status));
