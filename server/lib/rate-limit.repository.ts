/** The rate-limit counters' table: one row a key, reset when its window ends. */
import type { Knex } from 'knex';

export async function hit(knex: Knex, key: string, windowMs: number) {
  const { rows } = await knex.raw<{ rows: { hits: number; reset_at: Date }[] }>(
    `insert into rate_limit_hits (key, hits, reset_at)
     values (?, 1, now() + (? * interval '1 millisecond'))
     on conflict (key) do update set
       hits = case when rate_limit_hits.reset_at <= now() then 1 else rate_limit_hits.hits + 1 end,
       reset_at = case when rate_limit_hits.reset_at <= now() then excluded.reset_at else rate_limit_hits.reset_at end
     returning hits, reset_at`,
    [key, windowMs],
  );
  return { hits: rows[0].hits, resetAt: rows[0].reset_at };
}

export async function unhit(knex: Knex, key: string) {
  await knex('rate_limit_hits')
    .where({ key })
    .update({ hits: knex.raw('greatest(hits - 1, 0)') });
}

export async function reset(knex: Knex, key: string) {
  await knex('rate_limit_hits').where({ key }).delete();
}
