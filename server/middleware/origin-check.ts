import type { RequestHandler } from 'express';
import { AppError } from '../lib/errors';

const stateChanging = new Set(['POST', 'PUT', 'PATCH', 'DELETE']);

/**
 * Cross-site request forgery guard: a state-changing request must carry an
 * Origin header equal to the app's own origin (scheme + the Host it was sent
 * to) or one listed in ALLOWED_ORIGINS. Browsers always send Origin on these.
 */
export function originCheck(allowed: string[]): RequestHandler {
  return (req, _res, next) => {
    if (!stateChanging.has(req.method)) return next();
    const origin = req.get('origin');
    const own = `${req.protocol}://${req.get('host')}`;
    if (!origin || (origin !== own && !allowed.includes(origin))) {
      throw new AppError(403, 'bad_origin', "This request did not come from Headroom's own pages");
    }
    next();
  };
}
