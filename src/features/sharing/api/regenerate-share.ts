import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { ShareSettings } from '@shared/schemas/sharing';
import { api } from '@/lib/api-client';
import { getShareQueryOptions, sharePath } from './get-share';

/** A new address for the public page; the old one stops working at once. */
export async function regenerateShare(buildId: string): Promise<ShareSettings> {
  const data = await api.post<{ share: ShareSettings }>(`${sharePath(buildId)}/regenerate`, {});
  return data.share;
}

export const useRegenerateShare = (buildId: string) => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: () => regenerateShare(buildId),
    onSuccess: (share) => {
      queryClient.setQueryData(getShareQueryOptions(buildId).queryKey, share);
    },
  });
};
