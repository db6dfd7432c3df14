import { queryOptions, useQuery } from '@tanstack/react-query';
import type { Wrench } from '@shared/schemas/wrenches';
import { api } from '@/lib/api-client';

/** The signed-in person's own torque wrenches, by name. */
export async function getWrenches(signal?: AbortSignal): Promise<Wrench[]> {
  const data = await api.get<{ wrenches: Wrench[] }>('/api/me/wrenches', { signal });
  return data.wrenches;
}

export const getWrenchesQueryOptions = () =>
  queryOptions({
    queryKey: ['me', 'wrenches'] as const,
    queryFn: ({ signal }) => getWrenches(signal),
  });

export const useWrenches = () => useQuery(getWrenchesQueryOptions());
