import type { Knex } from 'knex';
import {
  passwordResetErrorCodes as codes,
  passwordResetValidMinutes,
} from '@shared/schemas/password-reset';
import { hashPassword, type SessionUser } from '@server/lib/auth';
import { AppError } from '@server/lib/errors';
import { hashToken, isTokenShaped, newToken } from '@server/lib/tokens';
import { countQueuedSince, enqueueMail, mailDateTime } from '@server/features/mail';
import { findUserByEmail } from './auth.repository';
import * as repo from './password-reset.repository';
import { paths } from '@shared/paths';

/** Where the client lets a person choose the new password; the mail's button leads here. */
export const forgotPasswordPath = '/forgot-password';

/** At most this many reset mails to one address an hour, whoever asks: no mail-bombing through us. */
export const maxResetMailsPerHour = 3;

/**
 * Mails a reset link when an account uses the address; does nothing visible
 * otherwise. The caller answers the same either way, and the mail itself is
 * only queued, so the answer takes about as long either way too.
 */
export async function request(knex: Knex, email: string): Promise<void> {
  const user = await findUserByEmail(knex, email);
  if (!user) return;
  if (
    (await countQueuedSince(knex, 'password-reset', user.email, new Date(Date.now() - 3600_000))) >=
    maxResetMailsPerHour
  )
    return;
  const { token, hash } = newToken();
  const expiresAt = new Date(Date.now() + passwordResetValidMinutes * 60_000);
  await knex.transaction(async (trx) => {
    await repo.replaceUnused(trx, user.id, hash, expiresAt);
    await enqueueMail(trx, {
      kind: 'password-reset',
      to: user.email,
      subject: 'Set a new Headroom password',
      heading: 'Set a new password',
      body: [
        `Someone — we hope you — asked to set a new password for the Headroom account ${user.email}.`,
        `The link works once and until ${mailDateTime(expiresAt)}. Setting a new password signs this account out everywhere else.`,
      ].join('\n\n'),
      action: { label: 'Set a new password', path: paths.auth.resetPassword.getHref(token) },
      footer: 'If you did not ask for this, ignore this mail: your password stays as it is.',
    });
  });
}

const refusals = {
  notFound: () =>
    new AppError(
      404,
      codes.notFound,
      'This link is not valid. Ask for a new one from the sign-in page.',
    ),
  expired: () =>
    new AppError(
      404,
      codes.expired,
      'This link has expired: links work for an hour. Ask for a new one.',
    ),
  used: () =>
    new AppError(
      404,
      codes.used,
      'This link has already been used. Ask for a new one if you need to.',
    ),
};

async function usable(knex: Knex, token: string, opts: { forUpdate?: boolean } = {}) {
  if (!isTokenShaped(token)) throw refusals.notFound();
  const row = await repo.findByTokenHash(knex, hashToken(token), opts);
  if (!row) throw refusals.notFound();
  if (row.used_at) throw refusals.used();
  if (row.expires_at <= new Date()) throw refusals.expired();
  return row;
}

/** For the page behind the link: is it still good, and for which address. */
export async function check(knex: Knex, token: string) {
  const row = await usable(knex, token);
  return { email: row.email, expiresAt: row.expires_at.toISOString() };
}

/**
 * Sets the new password and uses up the link, in one transaction with the link
 * locked. The caller then ends every session of the user.
 */
export async function complete(knex: Knex, token: string, password: string): Promise<SessionUser> {
  const passwordHash = await hashPassword(password);
  return knex.transaction(async (trx) => {
    const row = await usable(trx, token, { forUpdate: true });
    await repo.setPasswordHash(trx, row.user_id, passwordHash);
    await repo.markUsed(trx, row.id);
    await repo.deleteOtherUnused(trx, row.user_id, row.id);
    await enqueueMail(trx, {
      kind: 'password-changed',
      to: row.email,
      subject: 'Your Headroom password was changed',
      heading: 'Your password was changed',
      body: [
        `The password of the Headroom account ${row.email} was changed with a reset link, and every device that was signed in to it was signed out.`,
        'If that was not you, set a new password now and check who can read your mail.',
      ].join('\n\n'),
      action: { label: 'Set a new password', path: forgotPasswordPath },
    });
    return { id: row.user_id, email: row.email, displayName: row.display_name };
  });
}
