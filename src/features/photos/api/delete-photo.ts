import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { invalidatePhotos } from './invalidate';

/** Owner only: the photo and both stored sizes go. */
export async function deletePhoto({
  buildId,
  photoId,
}: {
  buildId: string;
  photoId: string;
}): Promise<void> {
  await api.delete(
    `/api/builds/${encodeURIComponent(buildId)}/photos/${encodeURIComponent(photoId)}`,
  );
}

export const useDeletePhoto = () => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: deletePhoto,
    onSuccess: (_data, { buildId }) => invalidatePhotos(queryClient, buildId),
  });
};
