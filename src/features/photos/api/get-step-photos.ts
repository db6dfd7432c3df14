import { queryOptions, useQuery } from '@tanstack/react-query';
import type { Photo } from '../../../../shared/schemas/photos';
import { api } from '../../../lib/api-client';

/** One step's photos, oldest first (they read as a log of the work). */
export async function getStepPhotos(
  buildId: string,
  stepId: string,
  signal?: AbortSignal,
): Promise<Photo[]> {
  const data = await api.get<{ photos: Photo[] }>(
    `/api/builds/${encodeURIComponent(buildId)}/steps/${encodeURIComponent(stepId)}/photos`,
    { signal },
  );
  return data.photos;
}

export const getStepPhotosQueryOptions = (buildId: string, stepId: string) =>
  queryOptions({
    queryKey: ['builds', buildId, 'photos', 'steps', stepId] as const,
    queryFn: ({ signal }) => getStepPhotos(buildId, stepId, signal),
  });

export const useStepPhotos = (buildId: string, stepId: string) =>
  useQuery(getStepPhotosQueryOptions(buildId, stepId));
