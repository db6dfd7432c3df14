import type { Knex } from 'knex';
import type { Role } from '@shared/permissions';
import type { Invitation } from '@shared/schemas/invitations';

export type InvitationRow = {
  id: string;
  build_id: string;
  email: string;
  role: Role;
  token_hash: string;
  invited_by: string | null;
  inviter_name: string | null;
  expires_at: Date;
  last_sent_at: Date;
  send_count: number;
  accepted_at: Date | null;
  revoked_at: Date | null;
  created_at: Date;
};

function toInvitation(row: InvitationRow, now = new Date()): Invitation {
  return {
    id: row.id,
    email: row.email,
    role: row.role,
    status: row.expires_at > now ? 'pending' : 'expired',
    invitedBy: row.inviter_name,
    createdAt: row.created_at.toISOString(),
    lastSentAt: row.last_sent_at.toISOString(),
    sendCount: row.send_count,
    expiresAt: row.expires_at.toISOString(),
  };
}

function base(knex: Knex) {
  return knex('build_invitations as i')
    .leftJoin('users as u', 'u.id', 'i.invited_by')
    .select('i.*', 'u.display_name as inviter_name');
}

/** Open invitations (neither accepted nor revoked) of a build, newest first; expired ones included. */
export async function listOpen(knex: Knex, buildId: string) {
  const rows: InvitationRow[] = await base(knex)
    .where('i.build_id', buildId)
    .whereNull('i.accepted_at')
    .whereNull('i.revoked_at')
    .orderBy('i.created_at', 'desc');
  const now = new Date();
  return rows.map((r) => toInvitation(r, now));
}

export async function findOpen(
  knex: Knex,
  buildId: string,
  id: string,
  opts: { forUpdate?: boolean } = {},
) {
  const q = knex('build_invitations')
    .where({ id, build_id: buildId })
    .whereNull('accepted_at')
    .whereNull('revoked_at')
    .first();
  if (opts.forUpdate) q.forUpdate();
  return (await q) as Omit<InvitationRow, 'inviter_name'> | undefined;
}

export async function findPresented(knex: Knex, id: string) {
  const row: InvitationRow | undefined = await base(knex).where('i.id', id).first();
  return row ? toInvitation(row) : undefined;
}

export async function insertInvitation(
  knex: Knex,
  inv: {
    buildId: string;
    email: string;
    role: Role;
    tokenHash: string;
    invitedBy: string;
    expiresAt: Date;
  },
): Promise<string> {
  const [row] = await knex('build_invitations')
    .insert({
      build_id: inv.buildId,
      email: inv.email,
      role: inv.role,
      token_hash: inv.tokenHash,
      invited_by: inv.invitedBy,
      expires_at: inv.expiresAt,
    })
    .returning('id');
  return row.id;
}

/** A resend: a new token (the old link stops working) and a new expiry. */
export async function renewInvitation(knex: Knex, id: string, tokenHash: string, expiresAt: Date) {
  await knex('build_invitations')
    .where({ id })
    .update({
      token_hash: tokenHash,
      expires_at: expiresAt,
      last_sent_at: knex.fn.now(),
      send_count: knex.raw('send_count + 1'),
      updated_at: knex.fn.now(),
    });
}

export async function revokeInvitation(knex: Knex, buildId: string, id: string): Promise<boolean> {
  const n = await knex('build_invitations')
    .where({ id, build_id: buildId })
    .whereNull('accepted_at')
    .whereNull('revoked_at')
    .update({ revoked_at: knex.fn.now(), updated_at: knex.fn.now() });
  return n > 0;
}

export type TokenInvitationRow = Omit<InvitationRow, 'inviter_name'> & {
  build_name: string;
  inviter_name: string | null;
  account_exists: boolean;
};

/** The invitation a link points at, with what its page shows; locked when accepting. */
export async function findByTokenHash(
  knex: Knex,
  tokenHash: string,
  opts: { forUpdate?: boolean } = {},
) {
  const q = knex('build_invitations as i')
    .join('builds as b', 'b.id', 'i.build_id')
    .leftJoin('users as u', 'u.id', 'i.invited_by')
    .where('i.token_hash', tokenHash)
    .select(
      'i.*',
      'b.name as build_name',
      'u.display_name as inviter_name',
      knex.raw('exists (select 1 from users x where x.email = i.email) as account_exists'),
    )
    .first();
  if (opts.forUpdate) q.forUpdate('i');
  return (await q) as TokenInvitationRow | undefined;
}

export async function markAccepted(knex: Knex, id: string, userId: string) {
  await knex('build_invitations')
    .where({ id })
    .update({ accepted_at: knex.fn.now(), accepted_by: userId, updated_at: knex.fn.now() });
}

export async function findMemberByEmail(knex: Knex, buildId: string, email: string) {
  return knex('build_members as m')
    .join('users as u', 'u.id', 'm.user_id')
    .where({ 'm.build_id': buildId, 'u.email': email })
    .first('m.user_id', 'm.role');
}

export async function buildName(knex: Knex, buildId: string): Promise<string | undefined> {
  const row = await knex('builds').where({ id: buildId }).first('name');
  return row?.name;
}

/**
 * Serialises the invitation sends of one sender (in the caller's transaction),
 * so simultaneous requests cannot all count below the limit and all send.
 */
export async function lockSender(trx: Knex.Transaction, senderId: string) {
  await trx.raw('select pg_advisory_xact_lock(hashtextextended(?, 0))', [
    `invitations:${senderId}`,
  ]);
}

/** Invitation mails sent since `since`, by a sender and to a build. */
export async function countSends(knex: Knex, buildId: string, senderId: string, since: Date) {
  const row = await knex('invitation_sends')
    .where('sent_at', '>', since)
    .select(
      knex.raw('count(*) filter (where sent_by = ?)::int as by_sender', [senderId]),
      knex.raw('count(*) filter (where build_id = ?)::int as to_build', [buildId]),
    )
    .first();
  return { bySender: row?.by_sender ?? 0, toBuild: row?.to_build ?? 0 };
}

export async function recordSend(knex: Knex, buildId: string, senderId: string) {
  await knex('invitation_sends').insert({ build_id: buildId, sent_by: senderId });
}
