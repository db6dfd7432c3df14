import type { RequestHandler } from 'express';
import { AppError } from '@server/lib/errors';

const stateChanging = new Set(['POST', 'PUT', 'PATCH', 'DELETE']);

/**
 * Cross-site request forgery guard: a state-changing request must carry an
 * Origin header equal to one of the configured origins (APP_URL's, or one in
 * ALLOWED_ORIGINS). Browsers always send Origin on these. The request's own
 * Host is never trusted: a DNS-rebinding page sets both Host and Origin to its
 * own name.
 */
export function originCheck(allowed: readonly string[]): RequestHandler {
  const origins = new Set(allowed);
  return (req, _res, next) => {
    if (!stateChanging.has(req.method)) return next();
    const origin = req.get('origin');
    if (!origin || !origins.has(origin)) {
      throw new AppError(403, 'bad_origin', "This request did not come from Headroom's own pages");
    }
    next();
  };
}

/** Host headers (name:port) of the configured origins: what a local-only page answers to. */
export function configuredHosts(allowed: readonly string[]): Set<string> {
  const hosts = new Set<string>();
  for (const o of allowed) {
    try {
      hosts.add(new URL(o).host);
    } catch {
      // not a URL: ignored
    }
  }
  return hosts;
}
