import type { RequestHandler } from 'express';
import type { Sessions } from '@server/lib/auth';
import { recordedByHeader } from '@shared/idempotency';
import { UnauthorizedError } from '@server/lib/errors';

// /builds/<uuid>… relative to /api: the build a request is about, looked up with the session.
const buildInPath =
  /^\/builds\/([0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12})(?:[/.]|$)/i;

/**
 * Attaches req.user when the session cookie is valid; never refuses by itself.
 * For a request under /builds/:buildId the same statement brings the caller's
 * role there, which the access check then uses instead of asking again.
 */
export function loadSession(sessions: Sessions): RequestHandler {
  return async (req, res, next) => {
    const buildId = buildInPath.exec(req.path)?.[1]?.toLowerCase() ?? null;
    const found = await sessions.resume(req, res, buildId);
    if (found) {
      req.user = found.user;
      req.sessionId = found.sessionId;
      req.sessionMembership = found.membership;
      // A write the offline queue kept for one user is never stored as another's.
      const recordedBy = req.get(recordedByHeader);
      if (
        recordedBy !== undefined &&
        recordedBy.trim().toLowerCase() !== found.user.id.toLowerCase()
      ) {
        throw new UnauthorizedError(
          'This entry was recorded by another person on this device; it waits for them to sign in again',
          'recorded_by_someone_else',
        );
      }
    }
    next();
  };
}

export const requireAuth: RequestHandler = (req, _res, next) => {
  if (!req.user) throw new UnauthorizedError();
  next();
};
