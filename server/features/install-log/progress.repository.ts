/**
 * How far each job has got, and which parts its unfinished steps still need: what the
 * timeline counts with. Two statements, whatever the build's size.
 */
import type { Knex } from 'knex';

export type JobProgress = {
  id: string;
  title: string;
  position: number;
  stepsTotal: number;
  stepsLeft: number;
  /** The first step not signed off (by position); null when every step is. */
  nextStepId: string | null;
  /** When the last step was signed off; null while any step is left. */
  finishedAt: Date | null;
};

export async function listJobProgress(knex: Knex, buildId: string): Promise<JobProgress[]> {
  const rows: {
    id: string;
    title: string;
    position: number;
    steps_total: number;
    steps_left: number;
    next_step_id: string | null;
    last_signed_off_at: Date | null;
  }[] = await knex('install_jobs as j')
    .where('j.build_id', buildId)
    .orderBy([{ column: 'j.position' }, { column: 'j.created_at' }])
    .select(
      'j.id',
      'j.title',
      'j.position',
      knex.raw('(select count(*) from install_steps s where s.job_id = j.id)::int as steps_total'),
      knex.raw(
        "(select count(*) from install_steps s where s.job_id = j.id and s.status <> 'signed-off')::int as steps_left",
      ),
      knex.raw(
        "(select s.id from install_steps s where s.job_id = j.id and s.status <> 'signed-off' order by s.position, s.created_at limit 1) as next_step_id",
      ),
      knex.raw(
        '(select max(s.signed_off_at) from install_steps s where s.job_id = j.id) as last_signed_off_at',
      ),
    );
  return rows.map((r) => ({
    id: r.id,
    title: r.title,
    position: r.position,
    stepsTotal: r.steps_total,
    stepsLeft: r.steps_left,
    nextStepId: r.next_step_id,
    finishedAt: r.steps_total > 0 && r.steps_left === 0 ? r.last_signed_off_at : null,
  }));
}

/** Each part linked to a step not yet signed off, with the title of that step's job. */
export async function listPartsNeededByOpenSteps(
  knex: Knex,
  buildId: string,
): Promise<{ partId: string; jobTitle: string }[]> {
  const rows: { part_id: string; job_title: string }[] = await knex('install_step_parts as sp')
    .join('install_steps as s', 's.id', 'sp.step_id')
    .join('install_jobs as j', 'j.id', 's.job_id')
    .where('s.build_id', buildId)
    .whereNot('s.status', 'signed-off')
    .distinct('sp.part_id', 'j.title as job_title', 'j.position')
    .orderBy('j.position');
  return rows.map((r) => ({ partId: r.part_id, jobTitle: r.job_title }));
}
