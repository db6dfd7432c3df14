import type { RequestHandler } from 'express';
import type { pino } from 'pino';
import { redactTokens } from '@server/lib/tokens';

/**
 * One short line a request, once its answer has gone (or the client left):
 * method, URL with link tokens redacted, status and milliseconds. Never headers
 * (cookies) or bodies (passwords). Replaces pino-http, which built a child
 * logger and full request and response objects each time: about 65 µs of CPU a
 * request, measured with `npm run bench:api -- --cpu-prof`.
 */
export function requestLog(
  logger: pino.Logger,
  opts: { ignore?: (url: string) => boolean } = {},
): RequestHandler {
  return (req, res, next) => {
    const url = req.originalUrl;
    if (opts.ignore?.(url)) return next();
    const start = Date.now();
    res.once('close', () => {
      const status = res.statusCode;
      const line = {
        req: { method: req.method, url: redactTokens(url) },
        res: { status },
        responseTime: Date.now() - start,
      };
      if (!res.writableFinished) logger.warn(line, 'request aborted');
      else if (status >= 500) logger.error(line, 'request errored');
      else logger.info(line, 'request completed');
    });
    next();
  };
}
