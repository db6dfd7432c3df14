/**
 * Ordered siblings: jobs in a build, steps in a job, checklist items and
 * fastener specs in a step. Positions are 1..n among siblings.
 */
import type { Knex } from 'knex';

export type Ordered =
  'install_jobs' | 'install_steps' | 'install_checklist_items' | 'fastener_specs';
const parentOf: Record<Ordered, { column: string; table: string }> = {
  install_jobs: { column: 'build_id', table: 'builds' },
  install_steps: { column: 'job_id', table: 'install_jobs' },
  install_checklist_items: { column: 'step_id', table: 'install_steps' },
  fastener_specs: { column: 'step_id', table: 'install_steps' },
};

/**
 * Locks the parent row so two writers cannot number siblings at the same time.
 * Call inside a transaction before counting or renumbering.
 */
export async function lockParent(trx: Knex.Transaction, table: Ordered, parentId: string) {
  const parent = parentOf[table];
  await trx(parent.table).where({ id: parentId }).forUpdate().first('id');
}

export async function nextPosition(trx: Knex.Transaction, table: Ordered, parentId: string) {
  const row = await trx(table)
    .where(parentOf[table].column, parentId)
    .max<{ max: number | null }>('position as max')
    .first();
  return (row?.max ?? 0) + 1;
}

/** Moves one row to a 1-based place among its siblings and renumbers them 1..n. */
export async function moveTo(
  trx: Knex.Transaction,
  table: Ordered,
  parentId: string,
  id: string,
  position: number,
) {
  const rows: { id: string }[] = await trx(table)
    .where(parentOf[table].column, parentId)
    .orderBy([{ column: 'position' }, { column: 'created_at' }, { column: 'id' }])
    .select('id');
  const ids = rows.map((r) => r.id).filter((x) => x !== id);
  ids.splice(Math.max(0, Math.min(position - 1, ids.length)), 0, id);
  for (const [i, rowId] of ids.entries()) {
    await trx(table)
      .where({ id: rowId })
      .whereNot({ position: i + 1 })
      .update({ position: i + 1 });
  }
}

/** Renumbers the siblings 1..n after a delete, keeping their order. */
export async function closeGaps(trx: Knex.Transaction, table: Ordered, parentId: string) {
  const rows: { id: string; position: number }[] = await trx(table)
    .where(parentOf[table].column, parentId)
    .orderBy([{ column: 'position' }, { column: 'created_at' }, { column: 'id' }])
    .select('id', 'position');
  for (const [i, r] of rows.entries()) {
    if (r.position !== i + 1)
      await trx(table)
        .where({ id: r.id })
        .update({ position: i + 1 });
  }
}
