import { queryOptions, useQuery } from '@tanstack/react-query';
import type { Photo } from '@shared/schemas/photos';
import { api } from '@/lib/api-client';

/** The build's gallery, newest first. */
export async function getBuildPhotos(buildId: string, signal?: AbortSignal): Promise<Photo[]> {
  const data = await api.get<{ photos: Photo[] }>(
    `/api/builds/${encodeURIComponent(buildId)}/photos`,
    { signal },
  );
  return data.photos;
}

/** Its key is the prefix of every photo list of the build: invalidating it refreshes them all. */
export const getBuildPhotosQueryOptions = (buildId: string) =>
  queryOptions({
    queryKey: ['builds', buildId, 'photos'] as const,
    queryFn: ({ signal }) => getBuildPhotos(buildId, signal),
  });

export const useBuildPhotos = (buildId: string) => useQuery(getBuildPhotosQueryOptions(buildId));
