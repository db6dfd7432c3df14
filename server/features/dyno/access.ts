/**
 * What a caller may reach of a build's dyno days: every member sees every
 * session and run, except a shop, which sees only the sessions assigned to it
 * (its own dyno) and their runs. Something hidden answers 404, exactly like
 * something that does not exist.
 */
import { NotFoundError } from '@server/lib/errors';
import { parseId, type BuildScope } from '@server/lib/scope';
import * as runsRepo from './runs.repository';
import * as sessionsRepo from './sessions.repository';

export function sessionFilter({ caller }: BuildScope): sessionsRepo.SessionFilter {
  return caller.role === 'shop' ? { shopUserId: caller.userId } : {};
}

/** A session the caller may see, or 404. */
export async function loadSession(scope: BuildScope, rawSessionId: string) {
  const session = await sessionsRepo.findSession(
    scope.knex,
    scope.buildId,
    parseId(rawSessionId, 'Dyno session'),
    sessionFilter(scope),
  );
  if (!session) throw new NotFoundError('Dyno session not found');
  return session;
}

/** A run of a session the caller may see, with that session, or 404. */
export async function loadRun(scope: BuildScope, rawRunId: string) {
  const run = await runsRepo.findRun(scope.knex, scope.buildId, parseId(rawRunId, 'Run'));
  if (!run) throw new NotFoundError('Run not found');
  const session = await sessionsRepo.findSession(
    scope.knex,
    scope.buildId,
    run.sessionId,
    sessionFilter(scope),
  );
  if (!session) throw new NotFoundError('Run not found');
  return { run, session };
}
