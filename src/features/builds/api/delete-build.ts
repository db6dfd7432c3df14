import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { getBuildQueryOptions } from './get-build';
import { getBuildsQueryOptions } from './get-builds';

export async function deleteBuild(buildId: string): Promise<void> {
  await api.delete(`/api/builds/${encodeURIComponent(buildId)}`);
}

export const useDeleteBuild = ({ onDeleted }: { onDeleted?: () => void } = {}) => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: deleteBuild,
    onSuccess: async (_data, buildId) => {
      // Leave the build's pages before dropping their data, so nothing refetches into a 404.
      onDeleted?.();
      // Removes the build and everything nested under its key (members, …).
      queryClient.removeQueries({ queryKey: getBuildQueryOptions(buildId).queryKey });
      await queryClient.invalidateQueries({
        queryKey: getBuildsQueryOptions().queryKey,
        exact: true,
      });
    },
  });
};
