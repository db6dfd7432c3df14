import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { ShareSettings, UpdateShareInput } from '@shared/schemas/sharing';
import { apiRequest } from '@/lib/api-client';
import { getShareQueryOptions, sharePath } from './get-share';

export async function updateShare({
  buildId,
  input,
}: {
  buildId: string;
  input: UpdateShareInput;
}): Promise<ShareSettings> {
  const data = await apiRequest<{ share: ShareSettings }>(sharePath(buildId), {
    method: 'PUT',
    body: input,
  });
  return data.share;
}

/**
 * Saves one switch at a time. The switch moves at once (the settings are updated in the cache
 * before the answer) and moves back if the server refuses.
 */
export const useUpdateShare = (buildId: string) => {
  const queryClient = useQueryClient();
  const { queryKey } = getShareQueryOptions(buildId);
  return useMutation({
    mutationFn: (input: UpdateShareInput) => updateShare({ buildId, input }),
    onMutate: async (input) => {
      await queryClient.cancelQueries({ queryKey });
      const before = queryClient.getQueryData(queryKey);
      if (before) {
        const { sections, ...rest } = input;
        queryClient.setQueryData(queryKey, {
          ...before,
          ...rest,
          sections: { ...before.sections, ...sections },
        } as ShareSettings);
      }
      return { before };
    },
    onError: (_error, _input, context) => {
      if (context?.before) queryClient.setQueryData(queryKey, context.before);
    },
    onSuccess: (share) => {
      queryClient.setQueryData(queryKey, share);
    },
  });
};
