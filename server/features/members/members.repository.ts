import type { Knex } from 'knex';
import type { Role } from '@shared/permissions';

type MemberRow = {
  user_id: string;
  display_name: string;
  email: string;
  role: Role;
  created_at: Date;
};

export async function findRole(
  knex: Knex,
  buildId: string,
  userId: string,
): Promise<Role | undefined> {
  const row = await knex('build_members')
    .where({ build_id: buildId, user_id: userId })
    .first('role');
  return row?.role;
}

const memberColumns = ['m.user_id', 'u.display_name', 'u.email', 'm.role', 'm.created_at'];

function toMember(row: MemberRow) {
  return {
    userId: row.user_id,
    displayName: row.display_name,
    email: row.email,
    role: row.role,
    joinedAt: row.created_at.toISOString(),
  };
}
export type MemberRecord = ReturnType<typeof toMember>;

export async function listMembers(knex: Knex, buildId: string) {
  const rows: MemberRow[] = await knex('build_members as m')
    .join('users as u', 'u.id', 'm.user_id')
    .where('m.build_id', buildId)
    .orderByRaw("case m.role when 'owner' then 0 when 'crew' then 1 when 'shop' then 2 else 3 end")
    .orderBy('u.display_name')
    .select(memberColumns);
  return rows.map(toMember);
}

export async function findMember(knex: Knex, buildId: string, userId: string) {
  const row: MemberRow | undefined = await knex('build_members as m')
    .join('users as u', 'u.id', 'm.user_id')
    .where({ 'm.build_id': buildId, 'm.user_id': userId })
    .first(memberColumns);
  return row ? toMember(row) : undefined;
}

/** Returns false when the user is already a member. */
export async function insertMember(knex: Knex, buildId: string, userId: string, role: Role) {
  const rows = await knex('build_members')
    .insert({ build_id: buildId, user_id: userId, role })
    .onConflict(['build_id', 'user_id'])
    .ignore()
    .returning('user_id');
  return rows.length > 0;
}

export async function updateMemberRole(knex: Knex, buildId: string, userId: string, role: Role) {
  return knex('build_members')
    .where({ build_id: buildId, user_id: userId })
    .update({ role, updated_at: knex.fn.now() });
}

export async function deleteMember(knex: Knex, buildId: string, userId: string) {
  return knex('build_members').where({ build_id: buildId, user_id: userId }).delete();
}

/** Owners of a build, locked for the rest of the transaction so two demotions cannot race. */
export async function lockOwners(trx: Knex.Transaction, buildId: string): Promise<string[]> {
  const rows = await trx('build_members')
    .where({ build_id: buildId, role: 'owner' })
    .forUpdate()
    .select('user_id');
  return rows.map((r: { user_id: string }) => r.user_id);
}
