import type { IncomingMessage, ServerResponse } from 'node:http';
import type { RequestHandler } from 'express';
import helmet, { type HelmetOptions } from 'helmet';

/** helmet's settings for Headroom: its defaults, with the CSP opened to the photo store. */
export function helmetOptions(opts: { imageOrigin?: string; hsts: boolean }): HelmetOptions {
  return {
    contentSecurityPolicy: {
      directives: {
        // Images may come from the object store: its signed URLs are where photo routes redirect.
        'img-src': ["'self'", 'data:', 'blob:', ...(opts.imageOrigin ? [opts.imageOrigin] : [])],
        'upgrade-insecure-requests': null,
      },
    },
    strictTransportSecurity: opts.hsts,
  };
}

/**
 * helmet's headers, worked out once at start-up and set on every answer. With these
 * settings they depend on nothing in the request (no nonce, no directive computed per
 * request), and running helmet's dozen small middlewares on each request cost about a
 * tenth of a health check. tests/api/security-headers.test.ts holds every answer's
 * headers equal to helmet's own.
 */
export function securityHeaders(options: HelmetOptions): RequestHandler {
  const set: [string, string][] = [];
  const removed: string[] = [];
  let finished = false;
  const recorder = {
    setHeader(name: string, value: string | number | readonly string[]) {
      set.push([name, String(value)]);
      return recorder;
    },
    removeHeader(name: string) {
      removed.push(name);
    },
  };
  helmet(options)({} as IncomingMessage, recorder as unknown as ServerResponse, (err?: unknown) => {
    if (err) throw err;
    finished = true;
  });
  if (!finished) throw new Error('helmet did not set its headers at once');
  return (_req, res, next) => {
    for (const [name, value] of set) res.setHeader(name, value);
    for (const name of removed) res.removeHeader(name);
    next();
  };
}
