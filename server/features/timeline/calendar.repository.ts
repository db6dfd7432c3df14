/** The only place calendar_feeds is queried: one secret feed per member and build, kept hashed. */
import type { Knex } from 'knex';

export async function findFeed(knex: Knex, buildId: string, userId: string) {
  const row: { created_at: Date } | undefined = await knex('calendar_feeds')
    .where({ build_id: buildId, user_id: userId })
    .first('created_at');
  return row ? { createdAt: row.created_at.toISOString() } : undefined;
}

/** Stores a new token's hash for the member, replacing the old one (which stops working). */
export async function replaceFeed(knex: Knex, buildId: string, userId: string, tokenHash: string) {
  const [row] = await knex('calendar_feeds')
    .insert({ build_id: buildId, user_id: userId, token_hash: tokenHash })
    .onConflict(['build_id', 'user_id'])
    .merge({ token_hash: tokenHash, created_at: knex.fn.now(), updated_at: knex.fn.now() })
    .returning('created_at');
  return { createdAt: (row.created_at as Date).toISOString() };
}

export async function deleteFeed(knex: Knex, buildId: string, userId: string) {
  return knex('calendar_feeds').where({ build_id: buildId, user_id: userId }).delete();
}

/** Whose feed a token hash opens; undefined for a wrong or replaced token. */
export async function findByTokenHash(knex: Knex, tokenHash: string) {
  const row: { build_id: string; user_id: string } | undefined = await knex('calendar_feeds')
    .where({ token_hash: tokenHash })
    .first('build_id', 'user_id');
  return row ? { buildId: row.build_id, userId: row.user_id } : undefined;
}
