import type { Knex } from 'knex';
import { roleDescriptions, type Role } from '@shared/permissions';
import {
  invitationErrorCodes as codes,
  invitationValidDays,
  type AcceptInvitationInput,
  type CreateInvitationInput,
  type InvitationPreview,
} from '@shared/schemas/invitations';
import { idSchema } from '@shared/schemas/common';
import { hashPassword, type SessionUser } from '@server/lib/auth';
import { AppError, ConflictError, NotFoundError, UnauthorizedError } from '@server/lib/errors';
import { hashToken, isTokenShaped, newToken } from '@server/lib/tokens';
import { createUser, findUserByEmail } from '@server/features/auth';
import { enqueueMail, mailDateTime, quoted, type QueuedMail } from '@server/features/mail';
import { addMember, findRole } from '@server/features/members';
import * as repo from './invitations.repository';
import { paths } from '@shared/paths';

/** Where the client shows an invitation; the mail's button leads here. */

const expiry = () => new Date(Date.now() + invitationValidDays * 24 * 3600_000);

function invitationMail(p: {
  to: string;
  token: string;
  buildName: string;
  inviterName: string;
  role: Role;
  expiresAt: Date;
}): QueuedMail {
  const description =
    roleDescriptions[p.role].charAt(0).toLowerCase() + roleDescriptions[p.role].slice(1);
  return {
    kind: 'invitation',
    to: p.to,
    // Nothing a user typed goes in the subject: names are shown in the body, quoted, as data.
    subject: 'You are invited to a build on Headroom',
    heading: `Join ${quoted(p.buildName)} as ${p.role}`,
    body: [
      `${p.inviterName} invited you to the Headroom build ${quoted(p.buildName)} as ${p.role}: ${description}.`,
      `Headroom keeps a diesel build's parts, send-outs, install log and results in one place. Follow the link to join. If you have no Headroom account for ${p.to} yet, you create one on the way.`,
      `The link works once and until ${mailDateTime(p.expiresAt)}.`,
    ].join('\n\n'),
    action: { label: 'Accept the invitation', path: paths.auth.invite.getHref(p.token) },
    footer: `You received this because ${p.inviterName} entered ${p.to} on Headroom. If you did not expect it, ignore it: nothing happens unless you follow the link.`,
  };
}

/**
 * Invitation mails an owner may send, per hour and per day, counted per sender
 * and per build (INVITATIONS_PER_HOUR / _PER_DAY): enough for any real crew,
 * too few to use Headroom as a mailer.
 */
export type InvitationLimits = { perHour: number; perDay: number };

async function checkSendLimit(
  trx: Knex.Transaction,
  buildId: string,
  senderId: string,
  invitationLimits: InvitationLimits,
) {
  await repo.lockSender(trx, senderId);
  const now = Date.now();
  const hour = await repo.countSends(trx, buildId, senderId, new Date(now - 3600_000));
  const day = await repo.countSends(trx, buildId, senderId, new Date(now - 24 * 3600_000));
  const over =
    Math.max(hour.bySender, hour.toBuild) >= invitationLimits.perHour
      ? `${invitationLimits.perHour} an hour`
      : Math.max(day.bySender, day.toBuild) >= invitationLimits.perDay
        ? `${invitationLimits.perDay} a day`
        : null;
  if (over) {
    throw new AppError(
      429,
      'invitation_limit',
      `Headroom sends at most ${over} invitations from one owner or to one build. Try again later.`,
    );
  }
  await repo.recordSend(trx, buildId, senderId);
}

function isOpenInvitationConflict(err: unknown) {
  const e = err as { code?: string; constraint?: string };
  return e.code === '23505' && e.constraint === 'build_invitations_open';
}

export async function list(knex: Knex, buildId: string) {
  return repo.listOpen(knex, buildId);
}

/** The invitation row and its mail are written together, or neither is. */
export async function create(
  knex: Knex,
  buildId: string,
  inviter: SessionUser,
  input: CreateInvitationInput,
  limits: InvitationLimits,
) {
  if (await repo.findMemberByEmail(knex, buildId, input.email)) {
    throw new ConflictError('already_member', 'That person is already on this build', {
      email: 'Already on this build — change their role in the member list instead',
    });
  }
  const { token, hash } = newToken();
  const expiresAt = expiry();
  try {
    const id = await knex.transaction(async (trx) => {
      await checkSendLimit(trx, buildId, inviter.id, limits);
      const buildName = (await repo.buildName(trx, buildId))!;
      const invitationId = await repo.insertInvitation(trx, {
        buildId,
        email: input.email,
        role: input.role,
        tokenHash: hash,
        invitedBy: inviter.id,
        expiresAt,
      });
      await enqueueMail(
        trx,
        invitationMail({
          to: input.email,
          token,
          buildName,
          inviterName: inviter.displayName,
          role: input.role,
          expiresAt,
        }),
      );
      return invitationId;
    });
    return (await repo.findPresented(knex, id))!;
  } catch (err) {
    if (isOpenInvitationConflict(err)) {
      throw new ConflictError(
        'already_invited',
        'That address already has an open invitation to this build',
        {
          email: 'Already invited — resend or revoke that invitation in the list',
        },
      );
    }
    throw err;
  }
}

function invitationId(raw: string) {
  const parsed = idSchema.safeParse(raw);
  if (!parsed.success) throw new NotFoundError('Invitation not found');
  return parsed.data;
}

/** A new link (the old one stops working), valid for another full week, mailed again. */
export async function resend(
  knex: Knex,
  buildId: string,
  rawId: string,
  sender: SessionUser,
  limits: InvitationLimits,
) {
  const id = invitationId(rawId);
  const { token, hash } = newToken();
  const expiresAt = expiry();
  await knex.transaction(async (trx) => {
    const inv = await repo.findOpen(trx, buildId, id, { forUpdate: true });
    if (!inv) throw new NotFoundError('Invitation not found');
    await checkSendLimit(trx, buildId, sender.id, limits);
    const buildName = (await repo.buildName(trx, buildId))!;
    await repo.renewInvitation(trx, id, hash, expiresAt);
    await enqueueMail(
      trx,
      invitationMail({
        to: inv.email,
        token,
        buildName,
        inviterName: sender.displayName,
        role: inv.role,
        expiresAt,
      }),
    );
  });
  return (await repo.findPresented(knex, id))!;
}

export async function revoke(knex: Knex, buildId: string, rawId: string) {
  if (!(await repo.revokeInvitation(knex, buildId, invitationId(rawId))))
    throw new NotFoundError('Invitation not found');
}

const refusals = {
  notFound: () =>
    new AppError(
      404,
      codes.notFound,
      'This invitation link is not valid. Check that the whole link was copied, or ask the owner for a new one.',
    ),
  expired: () =>
    new AppError(
      404,
      codes.expired,
      'This invitation has expired. Ask the owner of the build to send it again.',
    ),
  revoked: () =>
    new AppError(404, codes.revoked, 'The owner of the build withdrew this invitation.'),
  used: () =>
    new AppError(
      404,
      codes.used,
      'This invitation has already been used. Sign in to open the build.',
    ),
};

/** The invitation a link points at, if it can still be used; otherwise the reason, as a 404. */
async function usable(knex: Knex, token: string, opts: { forUpdate?: boolean } = {}) {
  if (!isTokenShaped(token)) throw refusals.notFound();
  const inv = await repo.findByTokenHash(knex, hashToken(token), opts);
  if (!inv) throw refusals.notFound();
  if (inv.revoked_at) throw refusals.revoked();
  if (inv.accepted_at) throw refusals.used();
  if (inv.expires_at <= new Date()) throw refusals.expired();
  return inv;
}

export async function preview(knex: Knex, token: string): Promise<InvitationPreview> {
  const inv = await usable(knex, token);
  return {
    buildId: inv.build_id,
    buildName: inv.build_name,
    role: inv.role,
    email: inv.email,
    inviterName: inv.inviter_name,
    accountExists: inv.account_exists,
    expiresAt: inv.expires_at.toISOString(),
  };
}

export type AcceptResult = {
  user: SessionUser;
  build: { id: string; name: string };
  role: Role;
  /** False when the person was already a member: their role stays as it was. */
  joined: boolean;
  accountCreated: boolean;
};

/**
 * Accepts an invitation. Signed in: the account's e-mail must be the invited
 * one (a forwarded link must not put someone else on the build). Signed out:
 * a password and a name create the account for the invited address — the link
 * proves the address — and the caller signs in. The check, the membership and
 * the use of the link happen in one transaction with the invitation locked, so
 * a link is used once even when clicked twice at the same moment.
 */
export async function accept(
  knex: Knex,
  token: string,
  signedIn: SessionUser | undefined,
  input: AcceptInvitationInput,
): Promise<AcceptResult> {
  if (!signedIn && (input.password === undefined || input.displayName === undefined)) {
    await usable(knex, token); // a dead link says so before asking anyone to sign in
    throw new UnauthorizedError(
      'Sign in with the invited e-mail, or choose a password and name to create the account',
      codes.signInToAccept,
    );
  }
  // Hashing is slow on purpose: done before the transaction takes its lock.
  const passwordHash = !signedIn && input.password ? await hashPassword(input.password) : null;
  return knex.transaction(async (trx) => {
    const inv = await usable(trx, token, { forUpdate: true });
    let user: SessionUser;
    let accountCreated = false;
    if (signedIn) {
      if (signedIn.email !== inv.email) {
        throw new AppError(
          403,
          codes.otherAccount,
          `This invitation is for ${inv.email}. Sign out, then sign in with that address (or create its account) to accept.`,
        );
      }
      user = signedIn;
    } else {
      if (await findUserByEmail(trx, inv.email)) {
        throw new ConflictError(
          'email_taken',
          `An account for ${inv.email} already exists. Sign in with it, then accept.`,
          {
            email: 'An account with this e-mail already exists — sign in instead',
          },
        );
      }
      const created = await createUser(trx, {
        email: inv.email,
        displayName: input.displayName!,
        passwordHash: passwordHash!,
      });
      if (!created)
        throw new ConflictError(
          'email_taken',
          `An account for ${inv.email} already exists. Sign in with it, then accept.`,
        );
      user = created;
      accountCreated = true;
    }
    const joined = await addMember(trx, inv.build_id, user.id, inv.role);
    const role = joined ? inv.role : ((await findRole(trx, inv.build_id, user.id)) ?? inv.role);
    await repo.markAccepted(trx, inv.id, user.id);
    return {
      user,
      build: { id: inv.build_id, name: inv.build_name },
      role,
      joined,
      accountCreated,
    };
  });
}
