import { rateLimit, type Store, type ClientRateLimitInfo } from 'express-rate-limit';
import type { Knex } from 'knex';
import * as counters from '../lib/rate-limit.repository';

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
  opts: { prefix: string; limit: number; windowMs: number; message: string },
) {
  return rateLimit({
    windowMs: opts.windowMs,
    limit: opts.limit,
    standardHeaders: 'draft-7',
    legacyHeaders: false,
    store: new PostgresStore(knex, opts.prefix),
    handler: (_req, res) => {
      res.status(429).json({ error: { code: 'rate_limited', message: opts.message } });
    },
  });
}
