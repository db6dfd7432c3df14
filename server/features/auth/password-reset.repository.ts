import type { Knex } from 'knex';

export type ResetRow = {
  id: string;
  user_id: string;
  email: string;
  display_name: string;
  expires_at: Date;
  used_at: Date | null;
};

/** A new link replaces any unused one: only the newest mail works. */
export async function replaceUnused(
  knex: Knex,
  userId: string,
  tokenHash: string,
  expiresAt: Date,
) {
  await knex('password_resets').where({ user_id: userId }).whereNull('used_at').delete();
  await knex('password_resets').insert({
    user_id: userId,
    token_hash: tokenHash,
    expires_at: expiresAt,
  });
}

export async function findByTokenHash(
  knex: Knex,
  tokenHash: string,
  opts: { forUpdate?: boolean } = {},
) {
  const q = knex('password_resets as r')
    .join('users as u', 'u.id', 'r.user_id')
    .where('r.token_hash', tokenHash)
    .first('r.id', 'r.user_id', 'u.email', 'u.display_name', 'r.expires_at', 'r.used_at');
  if (opts.forUpdate) q.forUpdate('r');
  return (await q) as ResetRow | undefined;
}

export async function markUsed(knex: Knex, id: string) {
  await knex('password_resets').where({ id }).update({ used_at: knex.fn.now() });
}

/** After a reset, no other link of that user may work. */
export async function deleteOtherUnused(knex: Knex, userId: string, keepId: string) {
  await knex('password_resets')
    .where({ user_id: userId })
    .whereNull('used_at')
    .whereNot({ id: keepId })
    .delete();
}

export async function setPasswordHash(knex: Knex, userId: string, passwordHash: string) {
  await knex('users')
    .where({ id: userId })
    .update({ password_hash: passwordHash, updated_at: knex.fn.now() });
}
