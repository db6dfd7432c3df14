import type { QueryClient } from '@tanstack/react-query';
import { getBuildPhotosQueryOptions } from './get-build-photos';

/** Every photo list of the build: the gallery's key is the prefix of the step and part lists. */
export async function invalidatePhotos(queryClient: QueryClient, buildId: string): Promise<void> {
  await queryClient.invalidateQueries({ queryKey: getBuildPhotosQueryOptions(buildId).queryKey });
}
