import type { Knex } from 'knex';
import type { Role } from '@shared/permissions';
import { noticeKindDefaults, type NoticeKind } from '@shared/schemas/notices';

export type Recipient = { user_id: string; email: string; role: Role };

/** A member's choice of a kind: their own row, or the kind's default when they never chose. */
function chose(knex: Knex, kind: NoticeKind) {
  const row = knex('notice_preferences as p')
    .whereRaw('p.build_id = m.build_id and p.user_id = m.user_id')
    .where({ 'p.kind': kind, 'p.enabled': !noticeKindDefaults[kind] });
  // Kinds that are on unless switched off, and kinds that are off unless switched on.
  return (q: Knex.QueryBuilder) =>
    noticeKindDefaults[kind] ? q.whereNotExists(row) : q.whereExists(row);
}

/**
 * Members who should hear about a notice: those of the given roles plus the
 * named shop, less the person who acted and anyone who switched the kind off.
 */
export async function recipients(
  knex: Knex,
  buildId: string,
  kind: NoticeKind,
  audience: { roles: readonly Role[]; shopUserId?: string | null; actorUserId: string | null },
): Promise<Recipient[]> {
  const q = knex('build_members as m')
    .join('users as u', 'u.id', 'm.user_id')
    .where('m.build_id', buildId)
    .where((w) => {
      w.whereIn('m.role', audience.roles as Role[]);
      if (audience.shopUserId)
        w.orWhere((s) => s.where('m.role', 'shop').andWhere('m.user_id', audience.shopUserId!));
    })
    .modify(chose(knex, kind))
    .orderBy('u.email')
    .select('m.user_id', 'u.email', 'm.role');
  if (audience.actorUserId) q.whereNot('m.user_id', audience.actorUserId);
  return q;
}

export type Subscriber = Recipient & { build_id: string };

/**
 * Every member, across builds, who has a kind on, of the roles that hear it: for notices
 * sent on a schedule (the weekly digest) rather than on a change.
 */
export async function subscribers(
  knex: Knex,
  kind: NoticeKind,
  roles: readonly Role[],
): Promise<Subscriber[]> {
  return knex('build_members as m')
    .join('users as u', 'u.id', 'm.user_id')
    .whereIn('m.role', roles as Role[])
    .modify(chose(knex, kind))
    .orderBy([{ column: 'm.build_id' }, { column: 'u.email' }])
    .select('m.build_id', 'm.user_id', 'u.email', 'm.role');
}

export async function buildName(knex: Knex, buildId: string): Promise<string | undefined> {
  return (await knex('builds').where({ id: buildId }).first('name'))?.name;
}

export async function displayName(knex: Knex, userId: string): Promise<string | undefined> {
  return (await knex('users').where({ id: userId }).first('display_name'))?.display_name;
}

/** The kinds a member switched off or on explicitly; missing kinds take their default. */
export async function preferences(knex: Knex, buildId: string, userId: string) {
  const rows: { kind: string; enabled: boolean }[] = await knex('notice_preferences')
    .where({ build_id: buildId, user_id: userId })
    .select('kind', 'enabled');
  return rows;
}

/**
 * Writes the member's choice for every kind in one upsert, so simultaneous first
 * saves cannot collide on the primary key (the last one wins, as it should).
 */
export async function savePreferences(
  knex: Knex,
  buildId: string,
  userId: string,
  choices: { kind: NoticeKind; enabled: boolean }[],
) {
  if (!choices.length) return;
  await knex('notice_preferences')
    .insert(
      choices.map((c) => ({
        build_id: buildId,
        user_id: userId,
        kind: c.kind,
        enabled: c.enabled,
      })),
    )
    .onConflict(['build_id', 'user_id', 'kind'])
    .merge({ enabled: knex.raw('excluded.enabled'), updated_at: knex.fn.now() });
}
