/** The record of weekly digests queued: one row per build, member and week. */
import type { Knex } from 'knex';
import type { IsoDate } from '@shared/dates';

/** Members of a build whose digest for the week is already queued. */
export async function sentForWeek(knex: Knex, buildId: string, weekOf: IsoDate) {
  const rows: { user_id: string }[] = await knex('timeline_digests')
    .where({ build_id: buildId, week_of: weekOf })
    .select('user_id');
  return new Set(rows.map((r) => r.user_id));
}

/**
 * Claims the member's digest for the week. True for exactly one caller: a second process's
 * insert waits on the first's uncommitted row and then does nothing. Run it in the
 * transaction that queues the mail, so a claim never stands without its mail.
 */
export async function claimWeek(
  trx: Knex.Transaction,
  buildId: string,
  userId: string,
  weekOf: IsoDate,
): Promise<boolean> {
  const rows = await trx('timeline_digests')
    .insert({ build_id: buildId, user_id: userId, week_of: weekOf })
    .onConflict(['build_id', 'user_id', 'week_of'])
    .ignore()
    .returning('user_id');
  return rows.length === 1;
}
