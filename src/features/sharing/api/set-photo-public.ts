import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { ShareSettings } from '../../../../shared/schemas/sharing';
import { apiRequest } from '../../../lib/api-client';
import { getShareQueryOptions, sharePath } from './get-share';

/** Marks one of the build's photos public (shown on the public page) or private. */
export async function setPhotoPublic({
  buildId,
  photoId,
  isPublic,
}: {
  buildId: string;
  photoId: string;
  isPublic: boolean;
}): Promise<ShareSettings> {
  const data = await apiRequest<{ share: ShareSettings }>(
    `${sharePath(buildId)}/photos/${encodeURIComponent(photoId)}`,
    { method: 'PUT', body: { public: isPublic } },
  );
  return data.share;
}

export const useSetPhotoPublic = (buildId: string) => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: { photoId: string; isPublic: boolean }) =>
      setPhotoPublic({ buildId, ...input }),
    onSuccess: (share) => {
      queryClient.setQueryData(getShareQueryOptions(buildId).queryKey, share);
    },
  });
};
