import { queryOptions, useQuery } from '@tanstack/react-query';
import type { BenchComparisonAnswer } from '@shared/schemas/bench';
import { api } from '@/lib/api-client';
import { benchKey } from './invalidate';
import { benchSheetsUrl } from './paths';

/** Two sheets of one injector set side by side, and the power the change wins back. */
export function getBenchComparison(
  buildId: string,
  before: string,
  after: string,
  signal?: AbortSignal,
): Promise<BenchComparisonAnswer> {
  const query = `?before=${encodeURIComponent(before)}&after=${encodeURIComponent(after)}`;
  return api.get<BenchComparisonAnswer>(`${benchSheetsUrl(buildId)}/compare${query}`, { signal });
}

export const getBenchComparisonQueryOptions = (buildId: string, before: string, after: string) =>
  queryOptions({
    queryKey: [...benchKey(buildId), 'compare', before, after] as const,
    queryFn: ({ signal }) => getBenchComparison(buildId, before, after, signal),
  });

export const useBenchComparison = (buildId: string, before: string, after: string) =>
  useQuery({
    ...getBenchComparisonQueryOptions(buildId, before, after),
    enabled: Boolean(before && after && before !== after),
  });
