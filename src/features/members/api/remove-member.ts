import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { getBuildQueryOptions } from '@/features/builds/api/get-build';
import { getBuildsQueryOptions } from '@/features/builds/api/get-builds';
import { invalidateMembership } from './invalidate';

export async function removeMember({
  buildId,
  userId,
}: {
  buildId: string;
  userId: string;
  /** True when the signed-in user removes themselves: they lose access to the build. */
  leaving?: boolean;
}): Promise<void> {
  await api.delete(
    `/api/builds/${encodeURIComponent(buildId)}/members/${encodeURIComponent(userId)}`,
  );
}

export const useRemoveMember = ({ onLeft }: { onLeft?: () => void } = {}) => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: removeMember,
    onSuccess: async (_data, { buildId, leaving }) => {
      if (!leaving) return invalidateMembership(queryClient, buildId);
      // Leave the page before dropping its data, so it is not refetched into a 404.
      onLeft?.();
      queryClient.removeQueries({ queryKey: getBuildQueryOptions(buildId).queryKey });
      await queryClient.invalidateQueries({
        queryKey: getBuildsQueryOptions().queryKey,
        exact: true,
      });
    },
  });
};
