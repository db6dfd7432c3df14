import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { ShareSettings, UpdateShareInput } from '../../../../shared/schemas/sharing';
import { apiRequest } from '../../../lib/api-client';
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

export const useUpdateShare = (buildId: string) => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: UpdateShareInput) => updateShare({ buildId, input }),
    onSuccess: (share) => {
      queryClient.setQueryData(getShareQueryOptions(buildId).queryKey, share);
    },
  });
};
