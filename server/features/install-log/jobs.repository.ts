/** Jobs of a build: the install log's top level. */
import type { Knex } from 'knex';
import type { SignOffBlocker } from '@shared/install-log/sign-off';
import type { StepStatus } from '@shared/schemas/install-log';
import { namedRows } from '@server/lib/named-query';
import { iso, person } from './rows';
import type { StepRow } from './steps.repository';

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

/** A step as a job list shows it, with its checklist counts (see listJobsWithSteps). */
export type StepCounts = {
  id: string;
  jobId: string;
  position: number;
  title: string;
  status: StepStatus;
  signedOffBy: ReturnType<typeof person>;
  signedOffAt: string | null;
  overrideReason: string | null;
  overrideBlockers: SignOffBlocker[] | null;
  checklistDone: number;
  checklistTotal: number;
};

type JobStepRow = JobRow &
  Pick<
    StepRow,
    | 'status'
    | 'signed_off_by'
    | 'signed_off_by_name'
    | 'signed_off_at'
    | 'override_reason'
    | 'override_blockers'
  > & {
    step_id: string | null;
    step_position: number;
    step_title: string;
    checklist_total: number;
    checklist_done: number;
  };

/**
 * Jobs in order, each with its steps in order and their checklist counts: a row a step (one
 * with null step columns for a job without steps). Named statements with their columns
 * written out. The shop's text keeps only the steps linked to a part sent to that shop (a job
 * then may come with no step).
 *
 * Two texts, not one with a parameter that switches the shop's condition off: PostgreSQL
 * cannot plan `$1 is null or exists (…)` once for both cases, so it planned that statement
 * afresh on every request (half the list's database time). Each text here is planned once
 * per connection (tests/api/statement-plans.test.ts).
 */
const jobsWithStepsSql = (shopCondition: string) => `select j.id, j.build_id, j.position,
    j.title, j.notes, j.created_by, cu.display_name as created_by_name, j.created_at, j.updated_at,
    s.id as step_id, s.position as step_position, s.title as step_title, s.status,
    s.signed_off_by, su.display_name as signed_off_by_name, s.signed_off_at,
    s.override_reason, s.override_blockers,
    c.total as checklist_total, c.done as checklist_done
  from install_jobs j
  left join users cu on cu.id = j.created_by
  left join install_steps s on s.job_id = j.id${shopCondition}
  left join users su on su.id = s.signed_off_by
  left join lateral (
    select count(*)::int as total, (count(*) filter (where i.done_at is not null))::int as done
    from install_checklist_items i where i.step_id = s.id) c on true
  where j.build_id = ?
  order by j.position, j.created_at, j.id, s.position, s.created_at`;
const everyStepSql = jobsWithStepsSql('');
const shopStepsSql = jobsWithStepsSql(` and exists (
    select 1 from install_step_parts sp join parts p on p.id = sp.part_id
    where sp.step_id = s.id and p.shop_user_id = ?)`);

export async function listJobsWithSteps(knex: Knex, buildId: string, shopUserId: string | null) {
  const rows =
    shopUserId === null
      ? await namedRows<JobStepRow>(knex, 'jobs-with-steps', everyStepSql, [buildId])
      : await namedRows<JobStepRow>(knex, 'jobs-with-shop-steps', shopStepsSql, [
          shopUserId,
          buildId,
        ]);
  const jobs: (JobRecord & { steps: StepCounts[] })[] = [];
  for (const r of rows) {
    let job = jobs.at(-1);
    if (job?.id !== r.id) {
      job = { ...toJob(r), steps: [] };
      jobs.push(job);
    }
    if (r.step_id === null) continue;
    job.steps.push({
      id: r.step_id,
      jobId: r.id,
      position: r.step_position,
      title: r.step_title,
      status: r.status,
      signedOffBy: person(r.signed_off_by, r.signed_off_by_name),
      signedOffAt: iso(r.signed_off_at),
      overrideReason: r.override_reason,
      overrideBlockers: r.override_blockers,
      checklistDone: r.checklist_done,
      checklistTotal: r.checklist_total,
    });
  }
  return jobs;
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
