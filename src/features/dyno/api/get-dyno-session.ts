import { queryOptions, useQuery } from '@tanstack/react-query';
import type { SessionReport } from '@shared/dyno';
import type { DynoPlan, DynoRun, DynoSession } from '@shared/schemas/dyno';
import { api } from '@/lib/api-client';
import { dynoKey } from './keys';

export type DynoSessionAnswer = {
  session: DynoSession;
  /** As stored: uncorrected, curves included. */
  runs: DynoRun[];
  plan: DynoPlan;
  /** The server's report under its default standard; the page recomputes it for the chosen one. */
  report: SessionReport;
};

/**
 * One session with its runs as measured and the build's plan. The standard is not part of
 * the request: the page corrects the runs itself with shared/dyno, the same code the server
 * uses, so switching standards is instant.
 */
export function getDynoSession(
  buildId: string,
  sessionId: string,
  signal?: AbortSignal,
): Promise<DynoSessionAnswer> {
  return api.get<DynoSessionAnswer>(
    `/api/builds/${encodeURIComponent(buildId)}/dyno-sessions/${encodeURIComponent(sessionId)}`,
    { signal },
  );
}

export const getDynoSessionQueryOptions = (buildId: string, sessionId: string) =>
  queryOptions({
    queryKey: [...dynoKey(buildId), 'session', sessionId] as const,
    queryFn: ({ signal }) => getDynoSession(buildId, sessionId, signal),
  });

export const useDynoSession = (buildId: string, sessionId: string) =>
  useQuery(getDynoSessionQueryOptions(buildId, sessionId));
