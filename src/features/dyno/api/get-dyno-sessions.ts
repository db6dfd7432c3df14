import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import type { BuildDynoReport } from '@shared/dyno';
import type { CorrectionChoice, DynoPlan, DynoSessionSummary } from '@shared/schemas/dyno';
import { api } from '@/lib/api-client';
import { choiceSearch } from '../choice-search';
import { dynoKey } from './keys';

export type DynoSessionsAnswer = {
  sessions: DynoSessionSummary[];
  summary: BuildDynoReport;
  plan: DynoPlan;
};

/** The build's sessions (a shop: its own), each with its best run, and the build against its plan. */
export function getDynoSessions(
  buildId: string,
  choice: CorrectionChoice,
  signal?: AbortSignal,
): Promise<DynoSessionsAnswer> {
  return api.get<DynoSessionsAnswer>(
    `/api/builds/${encodeURIComponent(buildId)}/dyno-sessions${choiceSearch(choice)}`,
    { signal },
  );
}

export const getDynoSessionsQueryOptions = (buildId: string, choice: CorrectionChoice) =>
  queryOptions({
    queryKey: [...dynoKey(buildId), 'sessions', choice] as const,
    queryFn: ({ signal }) => getDynoSessions(buildId, choice, signal),
    // Switching standards keeps the old figures on screen until the new ones arrive.
    placeholderData: keepPreviousData,
  });

export const useDynoSessions = (buildId: string, choice: CorrectionChoice) =>
  useQuery(getDynoSessionsQueryOptions(buildId, choice));
