import { queryOptions, useQuery } from '@tanstack/react-query';
import type { BuildView } from '@shared/schemas/sharing';
import { api } from '@/lib/api-client';

export type BuildSheetAnswer = { sheet: BuildView; mayShowMoney: boolean };

/** The whole build for print; money only on the owner's sheet, and only when asked. */
export async function getBuildSheet(
  buildId: string,
  money: boolean,
  signal?: AbortSignal,
): Promise<BuildSheetAnswer> {
  return api.get<BuildSheetAnswer>(
    `/api/builds/${encodeURIComponent(buildId)}/sheet${money ? '?money=1' : ''}`,
    { signal },
  );
}

export const getBuildSheetQueryOptions = (buildId: string, money: boolean) =>
  queryOptions({
    queryKey: ['builds', buildId, 'sheet', { money }] as const,
    queryFn: ({ signal }) => getBuildSheet(buildId, money, signal),
  });

export const useBuildSheet = (buildId: string, money: boolean) =>
  useQuery(getBuildSheetQueryOptions(buildId, money));
