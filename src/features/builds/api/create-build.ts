import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { Build, CreateBuildInput } from '@shared/schemas/builds';
import { api } from '@/lib/api-client';
import { getBuildQueryOptions } from './get-build';
import { getBuildsQueryOptions } from './get-builds';

export async function createBuild(input: CreateBuildInput): Promise<Build> {
  const data = await api.post<{ build: Build }>('/api/builds', input);
  return data.build;
}

export const useCreateBuild = () => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createBuild,
    onSuccess: async (build) => {
      queryClient.setQueryData(getBuildQueryOptions(build.id).queryKey, build);
      await queryClient.invalidateQueries({
        queryKey: getBuildsQueryOptions().queryKey,
        exact: true,
      });
    },
  });
};
