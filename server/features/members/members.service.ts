import type { Knex } from 'knex';
import { can, type Role } from '@shared/permissions';
import type { UpdateMemberInput } from '@shared/schemas/builds';
import { idSchema } from '@shared/schemas/common';
import { ConflictError, NotFoundError } from '@server/lib/errors';
import * as repo from './members.repository';

function present(member: repo.MemberRecord, viewerRole: Role) {
  // E-mail addresses are for the owner, who manages access; others see names and roles.
  if (can(viewerRole, 'members:manage')) return member;
  const { email: _email, ...rest } = member;
  return rest;
}

export async function list(knex: Knex, buildId: string, viewerRole: Role) {
  const members = await repo.listMembers(knex, buildId);
  return members.map((m) => present(m, viewerRole));
}

function memberId(raw: string) {
  const parsed = idSchema.safeParse(raw);
  if (!parsed.success) throw new NotFoundError('Member not found');
  return parsed.data;
}

const lastOwner = () =>
  new ConflictError(
    'last_owner',
    'A build needs at least one owner. Make someone else owner first.',
  );

/** Role changes and removals run in a transaction that locks the owners, so a build never loses its last one. */
export async function changeRole(
  knex: Knex,
  buildId: string,
  rawUserId: string,
  input: UpdateMemberInput,
) {
  const userId = memberId(rawUserId);
  return knex.transaction(async (trx) => {
    const member = await repo.findMember(trx, buildId, userId);
    if (!member) throw new NotFoundError('Member not found');
    const owners = await repo.lockOwners(trx, buildId);
    if (member.role === 'owner' && input.role !== 'owner' && owners.length <= 1) throw lastOwner();
    await repo.updateMemberRole(trx, buildId, userId, input.role);
    return (await repo.findMember(trx, buildId, userId))!;
  });
}

export async function remove(knex: Knex, buildId: string, rawUserId: string) {
  const userId = memberId(rawUserId);
  await knex.transaction(async (trx) => {
    const member = await repo.findMember(trx, buildId, userId);
    if (!member) throw new NotFoundError('Member not found');
    const owners = await repo.lockOwners(trx, buildId);
    if (member.role === 'owner' && owners.length <= 1) throw lastOwner();
    await repo.deleteMember(trx, buildId, userId);
  });
}

/** A member's role on a build, or undefined for a stranger (the access check's question). */
export const findRole = (knex: Knex, buildId: string, userId: string) =>
  repo.findRole(knex, buildId, userId);

/** Adds a member inside the caller's transaction; false when they already are one. */
export const addMember = (knex: Knex, buildId: string, userId: string, role: Role) =>
  repo.insertMember(knex, buildId, userId, role);

/** An owner of the build, or undefined when the build does not exist. */
export async function anOwnerId(knex: Knex, buildId: string): Promise<string | undefined> {
  const owner = (await repo.listMembers(knex, buildId)).find((m) => m.role === 'owner');
  return owner?.userId;
}

/** Names and roles only, for a page that shows who is on the build (never their e-mail). */
export async function names(knex: Knex, buildId: string) {
  return (await repo.listMembers(knex, buildId)).map((m) => ({
    name: m.displayName,
    role: m.role,
  }));
}
