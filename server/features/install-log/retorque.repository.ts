/** Re-torque checks: the specs of a build that ask for a second torque pass after use. */
import type { Knex } from 'knex';
import type { StepStatus } from '@shared/schemas/install-log';
import { specs, toSpec, type SpecRow } from './fasteners.repository';
import { iso } from './rows';

/** Specs of a build that ask for a re-torque check, with their step and job. */
export async function listRetorqueSpecs(knex: Knex, buildId: string) {
  const rows: (SpecRow & {
    step_title: string;
    step_status: StepStatus;
    step_signed_off_at: Date | null;
    job_id: string;
    job_title: string;
  })[] = await specs(knex)
    .join('install_steps as s', 's.id', 'f.step_id')
    .join('install_jobs as j', 'j.id', 's.job_id')
    .where('s.build_id', buildId)
    .where((q) =>
      q.whereNotNull('f.retorque_after_heat_cycles').orWhereNotNull('f.retorque_after_miles'),
    )
    .orderBy([{ column: 'j.position' }, { column: 's.position' }, { column: 'f.position' }])
    .select(
      's.title as step_title',
      's.status as step_status',
      's.signed_off_at as step_signed_off_at',
      'j.id as job_id',
      'j.title as job_title',
    );
  return rows.map((r) => ({
    spec: toSpec(r),
    stepTitle: r.step_title,
    stepStatus: r.step_status,
    stepSignedOffAt: iso(r.step_signed_off_at),
    jobId: r.job_id,
    jobTitle: r.job_title,
  }));
}

export async function closeRetorque(knex: Knex, specId: string, userId: string, note: string) {
  await knex('fastener_specs').where({ id: specId }).update({
    retorque_closed_by: userId,
    retorque_closed_at: knex.fn.now(),
    retorque_close_note: note,
    updated_at: knex.fn.now(),
  });
}
