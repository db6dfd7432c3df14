import { queryOptions, useQuery } from '@tanstack/react-query';
import type { FastenerSpec, TorqueReading } from '@shared/schemas/install-log';
import { api } from '@/lib/api-client';
import { installBase, seg } from './paths';

export type FastenerReadings = { fastener: FastenerSpec; readings: TorqueReading[] };

/** Every reading of one fastener spec, superseded ones included (newest first per position). */
export async function getReadings(
  buildId: string,
  specId: string,
  signal?: AbortSignal,
): Promise<FastenerReadings> {
  return api.get<FastenerReadings>(`${installBase(buildId)}/fasteners/${seg(specId)}/readings`, {
    signal,
  });
}

export const getReadingsQueryOptions = (buildId: string, specId: string) =>
  queryOptions({
    queryKey: ['builds', buildId, 'install', 'fasteners', specId, 'readings'] as const,
    queryFn: ({ signal }) => getReadings(buildId, specId, signal),
  });

export const useReadings = (buildId: string, specId: string, { enabled = true } = {}) =>
  useQuery({ ...getReadingsQueryOptions(buildId, specId), enabled });
