/** The only place file_deletions is queried. Rows are queued by a database trigger. */
import type { Knex } from 'knex';

export type DueDeletion = { id: number; key: string; attempts: number };

/**
 * Claims up to `limit` due deletions for `leaseMs`: another worker skips them
 * meanwhile, and if this one dies they come due again when the lease ends.
 */
export async function claimDue(knex: Knex, leaseMs: number, limit: number): Promise<DueDeletion[]> {
  const { rows } = await knex.raw<{ rows: DueDeletion[] }>(
    `with due as (
       select id from file_deletions
       where next_attempt_at <= now()
       order by id
       limit ?
       for update skip locked
     )
     update file_deletions f
     set attempts = f.attempts + 1, next_attempt_at = now() + (? * interval '1 millisecond')
     from due where f.id = due.id
     returning f.id, f.key, f.attempts`,
    [limit, leaseMs],
  );
  return rows;
}

export async function markDone(knex: Knex, id: number) {
  await knex('file_deletions').where({ id }).delete();
}

export async function markRetry(knex: Knex, id: number, delayMs: number, error: string) {
  await knex('file_deletions')
    .where({ id })
    .update({
      last_error: error.slice(0, 500),
      next_attempt_at: knex.raw(`now() + (? * interval '1 millisecond')`, [delayMs]),
    });
}

/** Queues keys by hand: files written for rows that never committed. */
export async function queue(knex: Knex, keys: string[]) {
  if (!keys.length) return;
  await knex('file_deletions')
    .insert(keys.map((key) => ({ key })))
    .onConflict('key')
    .ignore();
}

export async function pending(knex: Knex): Promise<string[]> {
  return (await knex('file_deletions').orderBy('id').select('key')).map(
    (r: { key: string }) => r.key,
  );
}
