import { queryOptions, useQuery } from '@tanstack/react-query';
import type { Member } from '@shared/schemas/builds';
import { api } from '@/lib/api-client';

export async function getMembers(buildId: string, signal?: AbortSignal): Promise<Member[]> {
  const data = await api.get<{ members: Member[] }>(
    `/api/builds/${encodeURIComponent(buildId)}/members`,
    { signal },
  );
  return data.members;
}

export const getMembersQueryOptions = (buildId: string) =>
  queryOptions({
    queryKey: ['builds', buildId, 'members'] as const,
    queryFn: ({ signal }) => getMembers(buildId, signal),
  });

export const useMembers = (buildId: string) => useQuery(getMembersQueryOptions(buildId));
