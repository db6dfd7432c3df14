/**
 * Ordered siblings: jobs in a build, steps in a job, checklist items and
 * fastener specs in a step. Positions are 1..n among siblings.
 *
 * Every change to positions in a build's install log runs under one lock: a
 * transaction-scoped advisory lock on the build, taken by `lockOrdering` as the
 * transaction's first statement and released at commit or rollback. Two such
 * transactions in one build therefore run one after the other, and neither can
 * hold a row the other is waiting for. Row locks on the parents (builds, jobs)
 * could not give that: an insert of a step takes FOR KEY SHARE on its job and
 * its build, which a FOR UPDATE of either conflicts with, so two writers that
 * locked parents and children in different orders deadlocked. The positions
 * can only be counted or renumbered through what `lockOrdering` returns.
 */
import type { Knex } from 'knex';

type Ordered = 'install_jobs' | 'install_steps' | 'install_checklist_items' | 'fastener_specs';
const parentColumn: Record<Ordered, string> = {
  install_jobs: 'build_id',
  install_steps: 'job_id',
  install_checklist_items: 'step_id',
  fastener_specs: 'step_id',
};

/** The first key of the two-key advisory lock: "ILOG", so no other use of advisory locks collides. */
const lockSpace = 0x494c4f47;

/**
 * Takes the build's install-log ordering lock (waiting for it if need be) and
 * returns the operations that count and renumber siblings under it.
 * Call first in the transaction, before any row is read or written.
 */
export async function lockOrdering(trx: Knex.Transaction, buildId: string) {
  await trx.raw('select pg_advisory_xact_lock(?, hashtext(?))', [lockSpace, buildId]);
  return {
    /** The position after the last sibling. */
    nextPosition: (table: Ordered, parentId: string) => nextPosition(trx, table, parentId),
    /** Moves one row to a 1-based place among its siblings and renumbers them 1..n. */
    moveTo: async (table: Ordered, parentId: string, id: string, position: number) => {
      const ids = (await siblings(trx, table, parentId)).filter((x) => x !== id);
      ids.splice(Math.max(0, Math.min(position - 1, ids.length)), 0, id);
      await renumber(trx, table, ids);
    },
    /** Renumbers the siblings 1..n after a delete, keeping their order. */
    closeGaps: async (table: Ordered, parentId: string) =>
      renumber(trx, table, await siblings(trx, table, parentId)),
  };
}

async function nextPosition(trx: Knex.Transaction, table: Ordered, parentId: string) {
  const row = await trx(table)
    .where(parentColumn[table], parentId)
    .max<{ max: number | null }>('position as max')
    .first();
  return (row?.max ?? 0) + 1;
}

async function siblings(trx: Knex.Transaction, table: Ordered, parentId: string) {
  const rows: { id: string }[] = await trx(table)
    .where(parentColumn[table], parentId)
    .orderBy([{ column: 'position' }, { column: 'created_at' }, { column: 'id' }])
    .select('id');
  return rows.map((r) => r.id);
}

/** Gives ids[i] the position i + 1, in one statement, touching only rows whose position changes. */
async function renumber(trx: Knex.Transaction, table: Ordered, ids: string[]) {
  if (!ids.length) return;
  await trx.raw(
    `update ?? as t set position = o.position
       from unnest(?::uuid[]) with ordinality as o(id, position)
      where t.id = o.id and t.position <> o.position`,
    [table, ids],
  );
}
