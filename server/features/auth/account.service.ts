/**
 * The person's own account: name, e-mail and password. Changing the e-mail or the password
 * asks for the current password (an unlocked phone left in the garage is not enough). A
 * new e-mail address changes only when a link mailed to it is followed; the answer to the
 * request is the same whether or not that address already has an account, so the page
 * says nothing about other people's accounts. A new password ends every other session.
 */
import type { Knex } from 'knex';
import {
  emailChangeErrorCodes as codes,
  emailChangeValidHours,
  type ChangeEmailInput,
  type ChangePasswordInput,
  type EmailChangePreview,
  type UpdateProfileInput,
} from '@shared/schemas/account';
import { hashPassword, verifyPassword, type SessionUser } from '@server/lib/auth';
import { AppError, ConflictError, UnauthorizedError, ValidationError } from '@server/lib/errors';
import { hashToken, isTokenShaped, newToken } from '@server/lib/tokens';
import { enqueueMail, mailDateTime } from '@server/features/mail';
import * as repo from './account.repository';
import { setPasswordHash } from './password-reset.repository';
import { forgotPasswordPath } from './password-reset.service';
import { paths } from '@shared/paths';

/** Where the client confirms a new address; the mail's button leads here. */

/** At most this many change requests an hour per account: no mail-bombing through us. */
export const maxEmailChangesPerHour = 5;

async function me(knex: Knex, userId: string) {
  const row = await repo.findUser(knex, userId);
  if (!row) throw new UnauthorizedError();
  return row;
}

async function checkCurrentPassword(hash: string, password: string) {
  if (!(await verifyPassword(hash, password))) {
    throw new ValidationError('That is not your current password', {
      currentPassword: 'That is not your current password',
    });
  }
}

const toUser = (r: { id: string; email: string; display_name: string }): SessionUser => ({
  id: r.id,
  email: r.email,
  displayName: r.display_name,
});

export async function updateProfile(knex: Knex, userId: string, input: UpdateProfileInput) {
  await repo.setDisplayName(knex, userId, input.displayName);
  return toUser(await me(knex, userId));
}

/** Checks the password, then mails the new address a link (or, if it is taken, a note). */
export async function requestEmailChange(knex: Knex, userId: string, input: ChangeEmailInput) {
  const user = await me(knex, userId);
  await checkCurrentPassword(user.password_hash, input.currentPassword);
  if (input.email === user.email) {
    throw new ValidationError('That is already your address', {
      email: 'That is already your address',
    });
  }
  if (
    (await repo.countRecentChanges(knex, userId, new Date(Date.now() - 3600_000))) >=
    maxEmailChangesPerHour
  ) {
    throw new AppError(
      429,
      'rate_limited',
      'Too many address changes in an hour. Wait a while and try again.',
    );
  }
  const { token, hash } = newToken();
  const expiresAt = new Date(Date.now() + emailChangeValidHours * 3600_000);
  await knex.transaction(async (trx) => {
    if (await repo.emailTaken(trx, input.email)) {
      // Told to the address itself, never to the person asking: no account is disclosed. The
      // row (already expired: it has no link) counts toward the hourly limit all the same.
      await repo.replacePendingChange(trx, {
        userId,
        newEmail: input.email,
        tokenHash: hash,
        expiresAt: new Date(),
      });
      await enqueueMail(trx, {
        kind: 'email-change-taken',
        to: input.email,
        subject: 'Someone tried to move a Headroom account to this address',
        heading: 'This address already has an account',
        body: [
          `Someone signed in to Headroom asked to use ${input.email} for their account. This address already has a Headroom account, so nothing was changed.`,
          'If that was you, sign in with this address instead, or use another address for the other account.',
        ].join('\n\n'),
        action: { label: 'Sign in', path: '/sign-in' },
        footer: 'If you did not expect this, you can ignore it: your account is unchanged.',
      });
      return;
    }
    await repo.replacePendingChange(trx, {
      userId,
      newEmail: input.email,
      tokenHash: hash,
      expiresAt,
    });
    await enqueueMail(trx, {
      kind: 'email-change',
      to: input.email,
      subject: 'Confirm your new Headroom e-mail address',
      heading: 'Confirm your new address',
      body: [
        `${user.display_name} asked to use ${input.email} for their Headroom account instead of its present address.`,
        `Follow the link to confirm. It works once and until ${mailDateTime(expiresAt)}; until then the old address stays in use.`,
      ].join('\n\n'),
      action: { label: 'Confirm this address', path: paths.auth.confirmEmail.getHref(token) },
      footer:
        'If you did not ask for this, ignore this mail: nothing changes unless the link is followed.',
    });
  });
}

const refusals = {
  notFound: () =>
    new AppError(
      404,
      codes.notFound,
      'This link is not valid. Ask for a new one from your account page.',
    ),
  expired: () =>
    new AppError(
      404,
      codes.expired,
      `This link has expired: links work for ${emailChangeValidHours} hours. Ask for a new one from your account page.`,
    ),
  used: () => new AppError(404, codes.used, 'This link has already been used.'),
};

async function usable(knex: Knex, token: string, opts: { forUpdate?: boolean } = {}) {
  if (!isTokenShaped(token)) throw refusals.notFound();
  const row = await repo.findChangeByTokenHash(knex, hashToken(token), opts);
  if (!row) throw refusals.notFound();
  if (row.used_at) throw refusals.used();
  if (row.expires_at <= new Date()) throw refusals.expired();
  return row;
}

export async function previewEmailChange(knex: Knex, token: string): Promise<EmailChangePreview> {
  const row = await usable(knex, token);
  return { email: row.new_email, expiresAt: row.expires_at.toISOString() };
}

/**
 * Follows the link: the address changes, the link is used up, and the old address is told
 * (with the way back: a password reset). The link proves the new mailbox; the request had
 * already proved the password, so it works signed in or out.
 */
export async function confirmEmailChange(knex: Knex, token: string): Promise<SessionUser> {
  return knex.transaction(async (trx) => {
    const row = await usable(trx, token, { forUpdate: true });
    if (!(await repo.setEmail(trx, row.user_id, row.new_email))) {
      throw new ConflictError(
        codes.taken,
        'Another account has started using this address meanwhile, so yours was not changed.',
      );
    }
    await repo.markChangeUsed(trx, row.id);
    await enqueueMail(trx, {
      kind: 'email-changed',
      to: row.old_email,
      subject: 'Your Headroom e-mail address was changed',
      heading: 'Your address was changed',
      body: [
        `The Headroom account that used ${row.old_email} now uses ${row.new_email}. Sign in with the new address from now on.`,
        'If that was not you, set a new password with a reset link and tell the build owners you work with.',
      ].join('\n\n'),
      action: { label: 'Set a new password', path: forgotPasswordPath },
    });
    return { id: row.user_id, email: row.new_email, displayName: row.display_name };
  });
}

/** Checks the current password and sets the new one; the caller then ends every other session. */
export async function changePassword(knex: Knex, userId: string, input: ChangePasswordInput) {
  const user = await me(knex, userId);
  await checkCurrentPassword(user.password_hash, input.currentPassword);
  if (input.newPassword === input.currentPassword) {
    throw new ValidationError('Choose a password you have not been using', {
      newPassword: 'Choose a password you have not been using',
    });
  }
  const passwordHash = await hashPassword(input.newPassword);
  await knex.transaction(async (trx) => {
    await setPasswordHash(trx, userId, passwordHash);
    await enqueueMail(trx, {
      kind: 'password-changed',
      to: user.email,
      subject: 'Your Headroom password was changed',
      heading: 'Your password was changed',
      body: [
        `The password of the Headroom account ${user.email} was changed from its account page, and every other device that was signed in to it was signed out.`,
        'If that was not you, set a new password now and check who can read your mail.',
      ].join('\n\n'),
      action: { label: 'Set a new password', path: forgotPasswordPath },
    });
  });
  return toUser(user);
}
