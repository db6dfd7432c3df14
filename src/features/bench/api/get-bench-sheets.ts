import { queryOptions, useQuery } from '@tanstack/react-query';
import type { BenchSheetSummary } from '@shared/schemas/bench';
import { api } from '@/lib/api-client';
import { benchKey } from './invalidate';
import { benchSheetsUrl } from './paths';

/** The build's sheets the caller may see (a shop: its own), oldest test first; one part's with partId. */
export async function getBenchSheets(
  buildId: string,
  partId?: string,
  signal?: AbortSignal,
): Promise<BenchSheetSummary[]> {
  const query = partId ? `?partId=${encodeURIComponent(partId)}` : '';
  const data = await api.get<{ sheets: BenchSheetSummary[] }>(
    `${benchSheetsUrl(buildId)}${query}`,
    { signal },
  );
  return data.sheets;
}

export const getBenchSheetsQueryOptions = (buildId: string, partId?: string) =>
  queryOptions({
    queryKey: [...benchKey(buildId), 'list', partId ?? 'all'] as const,
    queryFn: ({ signal }) => getBenchSheets(buildId, partId, signal),
  });

export const useBenchSheets = (buildId: string, partId?: string) =>
  useQuery(getBenchSheetsQueryOptions(buildId, partId));
