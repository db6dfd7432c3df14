/** The person's own account row, and their pending e-mail changes (email_changes). */
import type { Knex } from 'knex';

export async function findUser(knex: Knex, userId: string) {
  const row:
    { id: string; email: string; display_name: string; password_hash: string } | undefined =
    await knex('users').where({ id: userId }).first('id', 'email', 'display_name', 'password_hash');
  return row;
}

export async function setDisplayName(knex: Knex, userId: string, displayName: string) {
  await knex('users')
    .where({ id: userId })
    .update({ display_name: displayName, updated_at: knex.fn.now() });
}

export async function emailTaken(knex: Knex, email: string) {
  return Boolean(await knex('users').where({ email }).first('id'));
}

/** A new request replaces any unused one: only the newest link works. */
export async function replacePendingChange(
  knex: Knex,
  c: { userId: string; newEmail: string; tokenHash: string; expiresAt: Date },
) {
  await knex('email_changes').where({ user_id: c.userId }).whereNull('used_at').delete();
  await knex('email_changes').insert({
    user_id: c.userId,
    new_email: c.newEmail,
    token_hash: c.tokenHash,
    expires_at: c.expiresAt,
  });
}

/** Changes asked for by this person since `since` (the ones replaced since are gone). */
export async function countRecentChanges(knex: Knex, userId: string, since: Date) {
  const row = await knex('email_changes')
    .where({ user_id: userId })
    .where('created_at', '>', since)
    .count<{ count: string }[]>('* as count')
    .first();
  return Number(row?.count ?? 0);
}

export type ChangeRow = {
  id: string;
  user_id: string;
  new_email: string;
  old_email: string;
  display_name: string;
  expires_at: Date;
  used_at: Date | null;
};

export async function findChangeByTokenHash(
  knex: Knex,
  tokenHash: string,
  opts: { forUpdate?: boolean } = {},
) {
  const q = knex('email_changes as c')
    .join('users as u', 'u.id', 'c.user_id')
    .where('c.token_hash', tokenHash)
    .first(
      'c.id',
      'c.user_id',
      'c.new_email',
      'u.email as old_email',
      'u.display_name',
      'c.expires_at',
      'c.used_at',
    );
  if (opts.forUpdate) q.forUpdate('c');
  return (await q) as ChangeRow | undefined;
}

/** Null when another account took the address meanwhile (users.email is unique). */
export async function setEmail(knex: Knex, userId: string, email: string) {
  const rows = await knex('users')
    .where({ id: userId })
    .whereNotExists(knex('users as x').where('x.email', email).whereNot('x.id', userId))
    .update({ email, updated_at: knex.fn.now() })
    .returning('id');
  return rows.length > 0;
}

export async function markChangeUsed(knex: Knex, id: string) {
  await knex('email_changes').where({ id }).update({ used_at: knex.fn.now() });
}
