import { rateLimit, type Store, type ClientRateLimitInfo } from 'express-rate-limit';
import type { Knex } from 'knex';

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
    const { rows } = await this.knex.raw<{ rows: { hits: number; reset_at: Date }[] }>(
      `insert into rate_limit_hits (key, hits, reset_at)
       values (?, 1, now() + (? * interval '1 millisecond'))
       on conflict (key) do update set
         hits = case when rate_limit_hits.reset_at <= now() then 1 else rate_limit_hits.hits + 1 end,
         reset_at = case when rate_limit_hits.reset_at <= now() then excluded.reset_at else rate_limit_hits.reset_at end
       returning hits, reset_at`,
      [this.prefix + key, this.windowMs],
    );
    return { totalHits: rows[0].hits, resetTime: rows[0].reset_at };
  }
  async decrement(key: string) {
    await this.knex('rate_limit_hits')
      .where({ key: this.prefix + key })
      .update({ hits: this.knex.raw('greatest(hits - 1, 0)') });
  }
  async resetKey(key: string) {
    await this.knex('rate_limit_hits')
      .where({ key: this.prefix + key })
      .delete();
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
