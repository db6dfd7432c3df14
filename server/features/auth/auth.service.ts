import type { Knex } from 'knex';
import type { SignInInput, SignUpInput } from '@shared/schemas/auth';
import { hashPassword, verifyPassword, type SessionUser } from '@server/lib/auth';
import { ConflictError, UnauthorizedError } from '@server/lib/errors';
import * as repo from './auth.repository';

export async function signUp(knex: Knex, input: SignUpInput): Promise<SessionUser> {
  const passwordHash = await hashPassword(input.password);
  const user = await repo.insertUser(knex, { ...input, passwordHash });
  if (!user) {
    throw new ConflictError('email_taken', 'An account with this e-mail already exists', {
      email: 'An account with this e-mail already exists — sign in instead',
    });
  }
  return user;
}

/** Same answer for an unknown e-mail and a wrong password, in about the same time. */
export async function signIn(knex: Knex, input: SignInInput): Promise<SessionUser> {
  const row = await repo.findUserByEmail(knex, input.email);
  const ok = await verifyPassword(row?.password_hash ?? null, input.password);
  if (!row || !ok) {
    throw new UnauthorizedError(
      'That e-mail and password do not match an account',
      'invalid_credentials',
    );
  }
  return { id: row.id, email: row.email, displayName: row.display_name };
}

/** The account with this e-mail (lower-cased by the schemas), or undefined. */
export const findUserByEmail = (knex: Knex, email: string) => repo.findUserByEmail(knex, email);

/** Creates an account inside the caller's transaction; null when the e-mail is taken. */
export const createUser = (
  knex: Knex,
  user: { email: string; displayName: string; passwordHash: string },
) => repo.insertUser(knex, user);
