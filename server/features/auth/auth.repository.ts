import type { Knex } from 'knex';

export type UserRow = { id: string; email: string; display_name: string; password_hash: string };

export async function findUserByEmail(knex: Knex, email: string) {
  return knex<UserRow>('users').where({ email }).first();
}

/** Inserts a user; returns null when the e-mail is already taken. */
export async function insertUser(
  knex: Knex,
  user: { email: string; displayName: string; passwordHash: string },
) {
  const [row] = await knex<UserRow>('users')
    .insert({ email: user.email, display_name: user.displayName, password_hash: user.passwordHash })
    .onConflict('email')
    .ignore()
    .returning(['id', 'email', 'display_name']);
  return row ? { id: row.id, email: row.email, displayName: row.display_name } : null;
}
