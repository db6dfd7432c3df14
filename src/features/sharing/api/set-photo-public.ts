import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { ShareSettings } from '@shared/schemas/sharing';
import { apiRequest } from '@/lib/api-client';
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

/** The box ticks at once (the settings are updated in the cache) and unticks if the server refuses. */
export const useSetPhotoPublic = (buildId: string) => {
  const queryClient = useQueryClient();
  const { queryKey } = getShareQueryOptions(buildId);
  return useMutation({
    mutationFn: (input: { photoId: string; isPublic: boolean }) =>
      setPhotoPublic({ buildId, ...input }),
    onMutate: async ({ photoId, isPublic }) => {
      await queryClient.cancelQueries({ queryKey });
      const before = queryClient.getQueryData(queryKey);
      if (before) {
        const others = before.publicPhotoIds.filter((id) => id !== photoId);
        queryClient.setQueryData(queryKey, {
          ...before,
          publicPhotoIds: isPublic ? [...others, photoId] : others,
          coverPhotoId: !isPublic && before.coverPhotoId === photoId ? null : before.coverPhotoId,
        });
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
