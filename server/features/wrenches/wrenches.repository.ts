/** Each person's torque wrenches (torque_wrenches), and a build's calibration interval. */
import type { Knex } from 'knex';
import type { Wrench } from '@shared/schemas/wrenches';

type WrenchRow = {
  id: string;
  user_id: string;
  name: string;
  calibrated_on: string | null;
  created_at: Date;
  updated_at: Date;
};

function toWrench(r: WrenchRow): Wrench {
  return {
    id: r.id,
    name: r.name,
    calibratedOn: r.calibrated_on,
    createdAt: r.created_at.toISOString(),
    updatedAt: r.updated_at.toISOString(),
  };
}

export async function listWrenches(knex: Knex, userId: string) {
  const rows: WrenchRow[] = await knex('torque_wrenches')
    .where({ user_id: userId })
    .orderByRaw('lower(name)');
  return rows.map(toWrench);
}

export async function findWrench(knex: Knex, userId: string, wrenchId: string) {
  const row: WrenchRow | undefined = await knex('torque_wrenches')
    .where({ id: wrenchId, user_id: userId })
    .first();
  return row ? toWrench(row) : undefined;
}

/** Fails on the unique index torque_wrenches_user_name when the person has one of that name. */
export async function insertWrench(
  knex: Knex,
  userId: string,
  input: { name: string; calibratedOn: string | null },
) {
  const [row]: WrenchRow[] = await knex('torque_wrenches')
    .insert({ user_id: userId, name: input.name, calibrated_on: input.calibratedOn })
    .returning('*');
  return toWrench(row);
}

export async function updateWrench(
  knex: Knex,
  wrenchId: string,
  input: { name?: string; calibratedOn?: string | null },
) {
  const row: Record<string, unknown> = { updated_at: knex.fn.now() };
  if (input.name !== undefined) row.name = input.name;
  if (input.calibratedOn !== undefined) row.calibrated_on = input.calibratedOn;
  await knex('torque_wrenches').where({ id: wrenchId }).update(row);
}

export async function deleteWrench(knex: Knex, wrenchId: string) {
  await knex('torque_wrenches').where({ id: wrenchId }).delete();
}

/** The months a wrench's calibration holds on a build (builds.wrench_calibration_months). */
export async function buildCalibrationMonths(knex: Knex, buildId: string): Promise<number> {
  const row = await knex('builds').where({ id: buildId }).first('wrench_calibration_months');
  return Number(row?.wrench_calibration_months);
}
