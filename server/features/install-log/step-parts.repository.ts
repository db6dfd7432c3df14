/** Which parts a step fits, and what that means for a shop: the steps linked to its parts. */
import type { Knex } from 'knex';

export type StepPartLink = {
  stepId: string;
  id: string;
  name: string;
  category: string;
  status: string;
  shopUserId: string | null;
};

export async function listStepParts(knex: Knex, stepIds: string[]): Promise<StepPartLink[]> {
  if (!stepIds.length) return [];
  const rows: {
    step_id: string;
    id: string;
    name: string;
    category: string;
    status: string;
    shop_user_id: string | null;
  }[] = await knex('install_step_parts as sp')
    .join('parts as p', 'p.id', 'sp.part_id')
    .whereIn('sp.step_id', stepIds)
    .orderBy([{ column: 'p.category' }, { column: 'p.name' }])
    .select('sp.step_id', 'p.id', 'p.name', 'p.category', 'p.status', 'p.shop_user_id');
  return rows.map((r) => ({
    stepId: r.step_id,
    id: r.id,
    name: r.name,
    category: r.category,
    status: r.status,
    shopUserId: r.shop_user_id,
  }));
}

/** How many of these part ids are parts of the build (to refuse another build's parts). */
export async function countBuildParts(knex: Knex, buildId: string, partIds: string[]) {
  if (!partIds.length) return 0;
  const row = await knex('parts')
    .where({ build_id: buildId })
    .whereIn('id', partIds)
    .count<{ count: string }[]>('* as count')
    .first();
  return Number(row?.count ?? 0);
}

export async function setStepParts(trx: Knex.Transaction, stepId: string, partIds: string[]) {
  await trx('install_step_parts').where({ step_id: stepId }).delete();
  if (partIds.length) {
    await trx('install_step_parts').insert(
      [...new Set(partIds)].map((part_id) => ({ step_id: stepId, part_id })),
    );
  }
}

/** Steps a shop member may read: those linked to a part sent to that shop. */
export async function stepIdsForShop(
  knex: Knex,
  buildId: string,
  shopUserId: string,
): Promise<Set<string>> {
  const rows: { step_id: string }[] = await knex('install_step_parts as sp')
    .join('install_steps as s', 's.id', 'sp.step_id')
    .join('parts as p', 'p.id', 'sp.part_id')
    .where({ 's.build_id': buildId, 'p.shop_user_id': shopUserId })
    .distinct('sp.step_id');
  return new Set(rows.map((r) => r.step_id));
}

/** The shops whose parts a step fits (for naming the shop in a step's notices). */
export async function shopsOfStep(knex: Knex, stepId: string): Promise<string[]> {
  const rows: { shop_user_id: string }[] = await knex('install_step_parts as sp')
    .join('parts as p', 'p.id', 'sp.part_id')
    .where('sp.step_id', stepId)
    .whereNotNull('p.shop_user_id')
    .distinct('p.shop_user_id');
  return rows.map((r) => r.shop_user_id);
}
