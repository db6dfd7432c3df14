/** Jobs of a build: the install log's top level. */
import type { Knex } from 'knex';
import { person } from './rows';

type JobRow = {
  id: string;
  build_id: string;
  position: number;
  title: string;
  notes: string;
  created_by: string | null;
  created_by_name: string | null;
  created_at: Date;
  updated_at: Date;
};

function toJob(r: JobRow) {
  return {
    id: r.id,
    buildId: r.build_id,
    position: r.position,
    title: r.title,
    notes: r.notes,
    createdBy: person(r.created_by, r.created_by_name),
    createdAt: r.created_at.toISOString(),
    updatedAt: r.updated_at.toISOString(),
  };
}
export type JobRecord = ReturnType<typeof toJob>;

function jobs(knex: Knex, buildId: string) {
  return knex('install_jobs as j')
    .leftJoin('users as u', 'u.id', 'j.created_by')
    .where('j.build_id', buildId)
    .select('j.*', 'u.display_name as created_by_name');
}

export async function listJobs(knex: Knex, buildId: string) {
  const rows: JobRow[] = await jobs(knex, buildId).orderBy([
    { column: 'j.position' },
    { column: 'j.created_at' },
  ]);
  return rows.map(toJob);
}

export async function findJob(knex: Knex, buildId: string, jobId: string) {
  const row: JobRow | undefined = await jobs(knex, buildId).where('j.id', jobId).first();
  return row ? toJob(row) : undefined;
}

export async function insertJob(
  trx: Knex.Transaction,
  buildId: string,
  input: { title: string; notes?: string; position: number; createdBy: string },
) {
  const [row] = await trx('install_jobs')
    .insert({
      build_id: buildId,
      title: input.title,
      notes: input.notes ?? '',
      position: input.position,
      created_by: input.createdBy,
    })
    .returning('id');
  return row.id as string;
}

export async function updateJob(
  knex: Knex,
  jobId: string,
  input: { title?: string; notes?: string },
) {
  const row: Record<string, unknown> = {};
  if (input.title !== undefined) row.title = input.title;
  if (input.notes !== undefined) row.notes = input.notes;
  await knex('install_jobs')
    .where({ id: jobId })
    .update({ ...row, updated_at: knex.fn.now() });
}

export async function deleteJob(knex: Knex, jobId: string) {
  await knex('install_jobs').where({ id: jobId }).delete();
}
