import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { Build, UpdateBuildInput } from '@shared/schemas/builds';
import { api } from '@/lib/api-client';
import { getBuildQueryOptions } from './get-build';
import { getBuildsQueryOptions } from './get-builds';

export async function updateBuild({
  buildId,
  input,
}: {
  buildId: string;
  input: UpdateBuildInput;
}): Promise<Build> {
  const data = await api.patch<{ build: Build }>(
    `/api/builds/${encodeURIComponent(buildId)}`,
    input,
  );
  return data.build;
}

export const useUpdateBuild = () => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateBuild,
    onSuccess: async (build) => {
      queryClient.setQueryData(getBuildQueryOptions(build.id).queryKey, build);
      await queryClient.invalidateQueries({
        queryKey: getBuildsQueryOptions().queryKey,
        exact: true,
      });
    },
  });
};
