import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { Photo, UpdatePhotoInput } from '@shared/schemas/photos';
import { api } from '@/lib/api-client';
import { invalidatePhotos } from './invalidate';

export async function updatePhoto({
  buildId,
  photoId,
  input,
}: {
  buildId: string;
  photoId: string;
  input: UpdatePhotoInput;
}): Promise<Photo> {
  const data = await api.patch<{ photo: Photo }>(
    `/api/builds/${encodeURIComponent(buildId)}/photos/${encodeURIComponent(photoId)}`,
    input,
  );
  return data.photo;
}

export const useUpdatePhoto = () => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updatePhoto,
    onSuccess: (_photo, { buildId }) => invalidatePhotos(queryClient, buildId),
  });
};
