import type { Knex } from 'knex';
import type { Role } from '../../../shared/permissions';
import type { NoticeKind } from '../../../shared/schemas/notices';

export type Recipient = { user_id: string; email: string; role: Role };

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
    .whereNotExists(
      knex('notice_preferences as p')
        .whereRaw('p.build_id = m.build_id and p.user_id = m.user_id')
        .where({ 'p.kind': kind, 'p.enabled': false }),
    )
    .orderBy('u.email')
    .select('m.user_id', 'u.email', 'm.role');
  if (audience.actorUserId) q.whereNot('m.user_id', audience.actorUserId);
  return q;
}

export async function buildName(knex: Knex, buildId: string): Promise<string | undefined> {
  return (await knex('builds').where({ id: buildId }).first('name'))?.name;
}

export async function displayName(knex: Knex, userId: string): Promise<string | undefined> {
  return (await knex('users').where({ id: userId }).first('display_name'))?.display_name;
}

/** The kinds a member switched off or on explicitly; missing kinds are on. */
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
