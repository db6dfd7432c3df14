import { pino } from 'pino';

/**
 * One JSON line per event. Written asynchronously (a buffer flushed in the
 * background), so a request never waits on the terminal or a log pipe; the
 * server flushes it when it stops.
 *
 * `requests` writes the request log's lines to the same place without redaction:
 * they hold only the method, the URL with its link tokens redacted, the status and
 * the time (middleware/request-log.ts), and redaction's walk over every line was a
 * twentieth of a small read's CPU.
 */
export function createLogger(level: string) {
  const destination =
    level === 'silent' ? undefined : pino.destination({ sync: false, minLength: 4096 });
  const logger = pino(
    {
      level,
      redact: ['req.headers.cookie', 'res.headers["set-cookie"]', 'password', '*.password'],
    },
    destination,
  );
  return Object.assign(logger, { requests: pino({ level }, destination) });
}
export type Logger = ReturnType<typeof createLogger>;
