import type { QueryClient } from '@tanstack/react-query';
import { getBuildQueryOptions } from '@/features/builds/api/get-build';
import { getBuildsQueryOptions } from '@/features/builds/api/get-builds';
import { getMembersQueryOptions } from './get-members';

/**
 * A change to the member list also changes the build (member count, and my own role when
 * I changed myself) and the builds list, so all three are refetched.
 */
export async function invalidateMembership(queryClient: QueryClient, buildId: string) {
  await Promise.all([
    queryClient.invalidateQueries({ queryKey: getMembersQueryOptions(buildId).queryKey }),
    queryClient.invalidateQueries({
      queryKey: getBuildQueryOptions(buildId).queryKey,
      exact: true,
    }),
    queryClient.invalidateQueries({ queryKey: getBuildsQueryOptions().queryKey, exact: true }),
  ]);
}
