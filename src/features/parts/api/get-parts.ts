import { queryOptions, useQuery } from '@tanstack/react-query';
import type { Part } from '@shared/schemas/parts';
import { api } from '@/lib/api-client';

export async function getParts(buildId: string, signal?: AbortSignal): Promise<Part[]> {
  const data = await api.get<{ parts: Part[] }>(
    `/api/builds/${encodeURIComponent(buildId)}/parts`,
    { signal },
  );
  return data.parts;
}

export const getPartsQueryOptions = (buildId: string) =>
  queryOptions({
    queryKey: ['builds', buildId, 'parts'] as const,
    queryFn: ({ signal }) => getParts(buildId, signal),
  });

export const useParts = (buildId: string) => useQuery(getPartsQueryOptions(buildId));
