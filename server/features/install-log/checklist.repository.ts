/** A step's checklist items. */
import type { Knex } from 'knex';
import { iso, person } from './rows';

type ItemRow = {
  id: string;
  step_id: string;
  position: number;
  label: string;
  done_by: string | null;
  done_by_name: string | null;
  done_at: Date | null;
};

function toItem(r: ItemRow) {
  return {
    id: r.id,
    stepId: r.step_id,
    position: r.position,
    label: r.label,
    done: r.done_at != null,
    doneBy: r.done_at ? person(r.done_by, r.done_by_name) : null,
    doneAt: iso(r.done_at),
  };
}

function items(knex: Knex) {
  return knex('install_checklist_items as c')
    .leftJoin('users as u', 'u.id', 'c.done_by')
    .select('c.*', 'u.display_name as done_by_name');
}

export async function listChecklist(knex: Knex, stepIds: string[]) {
  if (!stepIds.length) return [];
  const rows: ItemRow[] = await items(knex)
    .whereIn('c.step_id', stepIds)
    .orderBy([{ column: 'c.position' }, { column: 'c.created_at' }]);
  return rows.map(toItem);
}

export async function findChecklistItem(knex: Knex, buildId: string, itemId: string) {
  const row: ItemRow | undefined = await items(knex)
    .join('install_steps as s', 's.id', 'c.step_id')
    .where({ 'c.id': itemId, 's.build_id': buildId })
    .first();
  return row ? toItem(row) : undefined;
}

export async function insertChecklistItem(
  trx: Knex.Transaction,
  stepId: string,
  label: string,
  position: number,
) {
  const [row] = await trx('install_checklist_items')
    .insert({ step_id: stepId, label, position })
    .returning('id');
  return row.id as string;
}

export async function updateChecklistItem(
  knex: Knex,
  itemId: string,
  input: { label?: string; done?: boolean; userId: string },
) {
  const row: Record<string, unknown> = { updated_at: knex.fn.now() };
  if (input.label !== undefined) row.label = input.label;
  if (input.done === true) {
    // Ticking an already-ticked item keeps who ticked it first.
    row.done_by = knex.raw('case when done_at is null then ? else done_by end', [input.userId]);
    row.done_at = knex.raw('coalesce(done_at, now())');
  } else if (input.done === false) {
    row.done_by = null;
    row.done_at = null;
  }
  await knex('install_checklist_items').where({ id: itemId }).update(row);
}

export async function deleteChecklistItem(knex: Knex, itemId: string) {
  await knex('install_checklist_items').where({ id: itemId }).delete();
}
