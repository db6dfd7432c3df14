import { queryOptions, useQuery } from '@tanstack/react-query';
import type { Photo } from '@shared/schemas/photos';
import { api } from '@/lib/api-client';
import type { PhotoTarget } from './upload-photo';

function targetSegment(target: PhotoTarget): ['steps' | 'parts', string] {
  return 'stepId' in target ? ['steps', target.stepId] : ['parts', target.partId];
}

/** The photos of one step or one part, oldest first (they read as a log of the work). */
export async function getAttachedPhotos(
  buildId: string,
  target: PhotoTarget,
  signal?: AbortSignal,
): Promise<Photo[]> {
  const [kind, id] = targetSegment(target);
  const data = await api.get<{ photos: Photo[] }>(
    `/api/builds/${encodeURIComponent(buildId)}/${kind}/${encodeURIComponent(id)}/photos`,
    { signal },
  );
  return data.photos;
}

export const getAttachedPhotosQueryOptions = (buildId: string, target: PhotoTarget) =>
  queryOptions({
    // Under the gallery's key, so invalidating the gallery refreshes this list too.
    queryKey: ['builds', buildId, 'photos', ...targetSegment(target)] as const,
    queryFn: ({ signal }) => getAttachedPhotos(buildId, target, signal),
  });

export const useAttachedPhotos = (buildId: string, target: PhotoTarget) =>
  useQuery(getAttachedPhotosQueryOptions(buildId, target));
