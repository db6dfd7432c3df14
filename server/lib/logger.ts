import { pino } from 'pino';

/**
 * One JSON line per event. Written asynchronously (a buffer flushed in the
 * background), so a request never waits on the terminal or a log pipe; the
 * server flushes it when it stops.
 */
export function createLogger(level: string) {
  return pino(
    {
      level,
      redact: ['req.headers.cookie', 'res.headers["set-cookie"]', 'password', '*.password'],
    },
    level === 'silent' ? undefined : pino.destination({ sync: false, minLength: 4096 }),
  );
}
export type Logger = ReturnType<typeof createLogger>;
