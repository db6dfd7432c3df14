import { queryOptions, useQuery } from '@tanstack/react-query';
import type { User } from '@shared/schemas/auth';
import { api, isApiError } from '@/lib/api-client';

/** The signed-in user, or null when there is no session (401 is an answer here, not an error). */
export async function getMe(signal?: AbortSignal): Promise<User | null> {
  try {
    const data = await api.get<{ user: User }>('/api/me', { signal, expectUnauthorized: true });
    return data.user;
  } catch (error) {
    if (isApiError(error) && error.status === 401) return null;
    throw error;
  }
}

export const getMeQueryOptions = () =>
  queryOptions({
    queryKey: ['me'] as const,
    queryFn: ({ signal }) => getMe(signal),
    staleTime: 5 * 60_000,
  });

export const useMe = () => useQuery(getMeQueryOptions());
