import { queryOptions, useQuery } from '@tanstack/react-query';
import type { Budget } from '@shared/schemas/parts';
import { api } from '@/lib/api-client';

export async function getBudget(buildId: string, signal?: AbortSignal): Promise<Budget> {
  const data = await api.get<{ budget: Budget }>(
    `/api/builds/${encodeURIComponent(buildId)}/budget`,
    { signal },
  );
  return data.budget;
}

export const getBudgetQueryOptions = (buildId: string) =>
  queryOptions({
    queryKey: ['builds', buildId, 'budget'] as const,
    queryFn: ({ signal }) => getBudget(buildId, signal),
  });

/** Only the owner may read the budget; other roles do not ask (the API would answer 403). */
export const useBudget = (buildId: string, { enabled = true }: { enabled?: boolean } = {}) =>
  useQuery({ ...getBudgetQueryOptions(buildId), enabled });
