/** Steps of a job, their status and sign-off, and the photo count shown on each step card. */
import type { Knex } from 'knex';
import type { ChoosableCautionId } from '@shared/install-log/cautions';
import type { SignOffBlocker } from '@shared/install-log/sign-off';
import type { StepStatus } from '@shared/schemas/install-log';
import { iso, person } from './rows';

export type StepRow = {
  id: string;
  build_id: string;
  job_id: string;
  position: number;
  title: string;
  description: string;
  lifts_vehicle: boolean;
  caution_ids: ChoosableCautionId[] | null;
  status: StepStatus;
  signed_off_by: string | null;
  signed_off_by_name: string | null;
  signed_off_at: Date | null;
  override_reason: string | null;
  override_blockers: SignOffBlocker[] | null;
  created_at: Date;
  updated_at: Date;
};

function toStep(r: StepRow) {
  return {
    id: r.id,
    buildId: r.build_id,
    jobId: r.job_id,
    position: r.position,
    title: r.title,
    description: r.description,
    liftsVehicle: r.lifts_vehicle,
    cautionChoice: r.caution_ids,
    status: r.status,
    signedOffBy: person(r.signed_off_by, r.signed_off_by_name),
    signedOffAt: iso(r.signed_off_at),
    overrideReason: r.override_reason,
    overrideBlockers: r.override_blockers,
    createdAt: r.created_at.toISOString(),
    updatedAt: r.updated_at.toISOString(),
  };
}
export type StepRecord = ReturnType<typeof toStep>;

function steps(knex: Knex, buildId: string) {
  return knex('install_steps as s')
    .leftJoin('users as u', 'u.id', 's.signed_off_by')
    .where('s.build_id', buildId)
    .select('s.*', 'u.display_name as signed_off_by_name');
}

export async function listSteps(knex: Knex, buildId: string, opts: { jobId?: string } = {}) {
  const q = steps(knex, buildId).orderBy([{ column: 's.position' }, { column: 's.created_at' }]);
  if (opts.jobId) q.where('s.job_id', opts.jobId);
  const rows: StepRow[] = await q;
  return rows.map(toStep);
}

export async function findStep(knex: Knex, buildId: string, stepId: string) {
  const row: StepRow | undefined = await steps(knex, buildId).where('s.id', stepId).first();
  return row ? toStep(row) : undefined;
}

export async function insertStep(
  trx: Knex.Transaction,
  buildId: string,
  jobId: string,
  input: {
    title: string;
    description?: string;
    liftsVehicle?: boolean;
    cautions?: ChoosableCautionId[] | null;
    position: number;
  },
) {
  const [row] = await trx('install_steps')
    .insert({
      build_id: buildId,
      job_id: jobId,
      title: input.title,
      description: input.description ?? '',
      lifts_vehicle: input.liftsVehicle ?? false,
      caution_ids: input.cautions ? JSON.stringify(input.cautions) : null,
      position: input.position,
    })
    .returning('id');
  return row.id as string;
}

export async function updateStep(
  knex: Knex,
  stepId: string,
  input: {
    title?: string;
    description?: string;
    liftsVehicle?: boolean;
    cautions?: ChoosableCautionId[] | null;
    status?: StepStatus;
  },
) {
  const row: Record<string, unknown> = {};
  if (input.title !== undefined) row.title = input.title;
  if (input.description !== undefined) row.description = input.description;
  if (input.liftsVehicle !== undefined) row.lifts_vehicle = input.liftsVehicle;
  if (input.cautions !== undefined) {
    row.caution_ids = input.cautions ? JSON.stringify(input.cautions) : null;
  }
  if (input.status !== undefined) row.status = input.status;
  await knex('install_steps')
    .where({ id: stepId })
    .update({ ...row, updated_at: knex.fn.now() });
}

/** A step moves from "not started" to "under way" when work is first recorded on it. */
export async function markUnderWay(knex: Knex, stepId: string) {
  await knex('install_steps')
    .where({ id: stepId, status: 'not-started' })
    .update({ status: 'under-way', updated_at: knex.fn.now() });
}

export async function signOffStep(
  knex: Knex,
  stepId: string,
  input: {
    userId: string;
    overrideReason: string | null;
    overrideBlockers: SignOffBlocker[] | null;
  },
) {
  await knex('install_steps')
    .where({ id: stepId })
    .update({
      status: 'signed-off',
      signed_off_by: input.userId,
      signed_off_at: knex.fn.now(),
      override_reason: input.overrideReason,
      override_blockers: input.overrideBlockers ? JSON.stringify(input.overrideBlockers) : null,
      updated_at: knex.fn.now(),
    });
}

export async function reopenStep(knex: Knex, stepId: string) {
  await knex('install_steps').where({ id: stepId }).update({
    status: 'under-way',
    signed_off_by: null,
    signed_off_at: null,
    override_reason: null,
    override_blockers: null,
    updated_at: knex.fn.now(),
  });
}

export async function lockStep(trx: Knex.Transaction, stepId: string) {
  const row: { status: StepStatus } | undefined = await trx('install_steps')
    .where({ id: stepId })
    .forUpdate()
    .first('status');
  return row?.status;
}

export async function deleteStep(knex: Knex, stepId: string) {
  await knex('install_steps').where({ id: stepId }).delete();
}

/** Photo counts per step (the photos feature's table, read here for the step cards). */
export async function countPhotosByStep(knex: Knex, stepIds: string[]) {
  if (!stepIds.length) return new Map<string, number>();
  const rows: { step_id: string; count: number }[] = await knex('photos')
    .whereIn('step_id', stepIds)
    .groupBy('step_id')
    .select('step_id', knex.raw('count(*)::int as count'));
  return new Map(rows.map((r) => [r.step_id, r.count]));
}
