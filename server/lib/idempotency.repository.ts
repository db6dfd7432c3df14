/** The idempotency keys' table: one row per user and key, with the request's hash and the answer given. */
import type { Knex } from 'knex';

export type StoredAnswer = { requestHash: string; status: number | null; body: unknown };

/**
 * Claims a key for this request. A concurrent claim of the same key waits here until the
 * first transaction ends; it then finds the key taken (false) or, if the first rolled back, claims it.
 */
export async function claim(trx: Knex.Transaction, userId: string, key: string, hash: string) {
  const rows: unknown[] = await trx('idempotency_keys')
    .insert({ user_id: userId, key, request_hash: hash })
    .onConflict(['user_id', 'key'])
    .ignore()
    .returning('key');
  return rows.length === 1;
}

export async function find(
  knex: Knex,
  userId: string,
  key: string,
): Promise<StoredAnswer | undefined> {
  const row:
    { request_hash: string; response_status: number | null; response_body: unknown } | undefined =
    await knex('idempotency_keys')
      .where({ user_id: userId, key })
      .first('request_hash', 'response_status', 'response_body');
  return row
    ? { requestHash: row.request_hash, status: row.response_status, body: row.response_body }
    : undefined;
}

export async function saveAnswer(
  trx: Knex.Transaction,
  userId: string,
  key: string,
  status: number,
  body: unknown,
) {
  await trx('idempotency_keys')
    .where({ user_id: userId, key })
    .update({ response_status: status, response_body: JSON.stringify(body ?? null) });
}

/** Removes keys older than the days given (every user's). */
export async function prune(knex: Knex, days: number) {
  return knex('idempotency_keys')
    .where('created_at', '<', knex.raw(`now() - (? * interval '1 day')`, [days]))
    .delete();
}
