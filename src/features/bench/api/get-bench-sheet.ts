import { queryOptions, useQuery } from '@tanstack/react-query';
import type { BenchSheetAnswer } from '@shared/schemas/bench';
import { api } from '@/lib/api-client';
import { benchKey } from './invalidate';
import { benchSheetUrl } from './paths';

/** One sheet with the server's judgement and the cost of its imbalance at the build's target. */
export function getBenchSheet(
  buildId: string,
  sheetId: string,
  signal?: AbortSignal,
): Promise<BenchSheetAnswer> {
  return api.get<BenchSheetAnswer>(benchSheetUrl(buildId, sheetId), { signal });
}

export const getBenchSheetQueryOptions = (buildId: string, sheetId: string) =>
  queryOptions({
    queryKey: [...benchKey(buildId), 'sheet', sheetId] as const,
    queryFn: ({ signal }) => getBenchSheet(buildId, sheetId, signal),
  });

export const useBenchSheet = (buildId: string, sheetId: string) =>
  useQuery(getBenchSheetQueryOptions(buildId, sheetId));
