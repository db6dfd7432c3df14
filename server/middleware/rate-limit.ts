import type { Request } from 'express';
import { rateLimit, type Store, type ClientRateLimitInfo } from 'express-rate-limit';
import type { Knex } from 'knex';
import * as counters from '@server/lib/rate-limit.repository';

/** Counters in PostgreSQL, shared by every app process and kept across restarts. */
class PostgresStore implements Store {
  windowMs = 60_000;
  prefix: string;
  constructor(
    private knex: Knex,
    prefix: string,
  ) {
    this.prefix = prefix;
  }
  init(options: { windowMs: number }) {
    this.windowMs = options.windowMs;
  }
  async increment(key: string): Promise<ClientRateLimitInfo> {
    const { hits, resetAt } = await counters.hit(this.knex, this.prefix + key, this.windowMs);
    return { totalHits: hits, resetTime: resetAt };
  }
  async decrement(key: string) {
    await counters.unhit(this.knex, this.prefix + key);
  }
  async resetKey(key: string) {
    await counters.reset(this.knex, this.prefix + key);
  }
}

export function createRateLimit(
  knex: Knex,
  opts: {
    prefix: string;
    limit: number;
    windowMs: number;
    message: string;
    /** Count only answers of 400 and above: a successful sign-in costs nothing. */
    failuresOnly?: boolean;
    /** The counter's key; the client's address by default. */
    key?: (req: Request) => string;
  },
) {
  return rateLimit({
    windowMs: opts.windowMs,
    limit: opts.limit,
    standardHeaders: 'draft-7',
    legacyHeaders: false,
    skipSuccessfulRequests: opts.failuresOnly ?? false,
    ...(opts.key ? { keyGenerator: opts.key } : {}),
    store: new PostgresStore(knex, opts.prefix),
    handler: (_req, res) => {
      res.status(429).json({ error: { code: 'rate_limited', message: opts.message } });
    },
  });
}

/**
 * The limits on one sign-in-like action, each on counters of its own: failures
 * per client address (a high ceiling: a garage shares one address), and with
 * `perAccount`, failures per e-mail address from anywhere (slows guessing at one
 * account). Successful attempts are not counted.
 */
export function authLimits(
  knex: Knex,
  config: { rateLimitPrefix: string; authRateLimit: number; accountRateLimit: number },
  action: string,
  opts: { perAccount?: boolean } = {},
) {
  const windowMs = 15 * 60_000;
  const message = 'Too many failed attempts. Wait 15 minutes and try again.';
  const limits = [
    createRateLimit(knex, {
      prefix: `${config.rateLimitPrefix}${action}:ip:`,
      limit: config.authRateLimit,
      windowMs,
      message,
      failuresOnly: true,
    }),
  ];
  if (opts.perAccount) {
    limits.push(
      createRateLimit(knex, {
        prefix: `${config.rateLimitPrefix}${action}:account:`,
        limit: config.accountRateLimit,
        windowMs,
        message: 'Too many failed sign-ins to this account. Wait 15 minutes and try again.',
        failuresOnly: true,
        key: (req) => {
          const email = (req.body as { email?: unknown } | undefined)?.email;
          return typeof email === 'string' ? email.trim().toLowerCase().slice(0, 320) : '-';
        },
      }),
    );
  }
  return limits;
}
