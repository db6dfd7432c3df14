/**
 * The dyno feature's public surface: the dyno days a caller may see, for the timeline, and
 * sessions with their best runs, for the build sheet.
 */
import type { BuildScope } from '@server/lib/scope';
import { sessionFilter } from './access';
import * as sessionsRepo from './sessions.repository';

export { listSessions } from './sessions.service';

/** Every dyno day the caller may see (a shop: those at its own dyno), with its date and place. */
export async function listDynoDays(scope: BuildScope) {
  const sessions = await sessionsRepo.listSessions(scope.knex, scope.buildId, sessionFilter(scope));
  return sessions.map((s) => ({
    id: s.id,
    date: s.date,
    place: s.place,
    dynoKind: s.dynoKind,
    runCount: s.runCount,
  }));
}
