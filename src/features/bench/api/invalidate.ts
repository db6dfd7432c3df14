import type { QueryClient } from '@tanstack/react-query';

/** Every bench query of a build: lists, sheets and comparisons share this key prefix. */
export const benchKey = (buildId: string) => ['builds', buildId, 'bench-sheets'] as const;

export async function invalidateBench(queryClient: QueryClient, buildId: string): Promise<void> {
  await queryClient.invalidateQueries({ queryKey: benchKey(buildId) });
}
