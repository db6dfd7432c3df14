import type { RequestHandler } from 'express';
import type { Sessions } from '../lib/auth';
import { UnauthorizedError } from '../lib/errors';

/** Attaches req.user when the session cookie is valid; never refuses by itself. */
export function loadSession(sessions: Sessions): RequestHandler {
  return async (req, res, next) => {
    const found = await sessions.resume(req, res);
    if (found) {
      req.user = found.user;
      req.sessionId = found.sessionId;
    }
    next();
  };
}

export const requireAuth: RequestHandler = (req, _res, next) => {
  if (!req.user) throw new UnauthorizedError();
  next();
};
