/** Torque readings: never edited, only superseded by a newer reading of the same position. */
import type { Knex } from 'knex';
import type { TorqueUnit } from '@shared/install-log/torque';
import { buildToday } from '@shared/dates';
import { iso, person } from './rows';

type ReadingRow = {
  id: string;
  spec_id: string;
  position: number;
  kind: 'install' | 'retorque';
  value: number;
  unit: TorqueUnit;
  stage: number | null;
  wrench: string;
  wrench_id: string | null;
  wrench_calibrated_on: string | null;
  wrench_calibration_due_on: string | null;
  note: string;
  recorded_by: string | null;
  recorded_by_name: string | null;
  recorded_at: Date;
  taken_at: Date | null;
  superseded_by_id: string | null;
  superseded_at: Date | null;
  /** The build's time zone: the reading's day is the build's today when it was recorded. */
  build_time_zone: string | null;
};

function toReading(r: ReadingRow) {
  return {
    id: r.id,
    specId: r.spec_id,
    position: r.position,
    kind: r.kind,
    value: r.value,
    unit: r.unit,
    stage: r.stage,
    wrench: r.wrench,
    wrenchId: r.wrench_id,
    calibration:
      r.wrench_id || r.wrench_calibration_due_on || r.wrench_calibrated_on
        ? {
            calibratedOn: r.wrench_calibrated_on,
            dueOn: r.wrench_calibration_due_on,
            overdue:
              r.wrench_calibration_due_on != null &&
              buildToday({ timeZone: r.build_time_zone }, r.taken_at ?? r.recorded_at) >
                r.wrench_calibration_due_on,
          }
        : null,
    note: r.note,
    recordedBy: person(r.recorded_by, r.recorded_by_name),
    recordedAt: r.recorded_at.toISOString(),
    takenAt: (r.taken_at ?? r.recorded_at).toISOString(),
    supersededById: r.superseded_by_id,
    supersededAt: iso(r.superseded_at),
  };
}
export type ReadingRecord = ReturnType<typeof toReading>;

/** Joins the reading's build (through its spec and step) for the build's time zone, as `b`. */
function withBuildZone(q: Knex.QueryBuilder) {
  return q
    .join('fastener_specs as f', 'f.id', 'r.spec_id')
    .join('install_steps as s', 's.id', 'f.step_id')
    .join('builds as b', 'b.id', 's.build_id');
}

/** Readings of these specs, newest first (superseded ones included). */
export async function listReadings(knex: Knex, specIds: string[]) {
  if (!specIds.length) return [];
  const rows: ReadingRow[] = await withBuildZone(knex('torque_readings as r'))
    .leftJoin('users as u', 'u.id', 'r.recorded_by')
    .whereIn('r.spec_id', specIds)
    .orderBy([
      { column: 'r.position' },
      { column: 'r.recorded_at', order: 'desc' },
      { column: 'r.superseded_at', order: 'desc', nulls: 'first' },
    ])
    .select('r.*', 'u.display_name as recorded_by_name', 'b.time_zone as build_time_zone');
  return rows.map(toReading);
}

export async function findReading(knex: Knex, readingId: string) {
  const row: ReadingRow | undefined = await withBuildZone(knex('torque_readings as r'))
    .leftJoin('users as u', 'u.id', 'r.recorded_by')
    .where('r.id', readingId)
    .first('r.*', 'u.display_name as recorded_by_name', 'b.time_zone as build_time_zone');
  return row ? toReading(row) : undefined;
}

/**
 * Records a reading. The current reading of the same spec, kind, position and
 * stage, if any, is kept and marked superseded by the new one. Run inside a
 * transaction that holds the step's row lock (lockStep), so two readings cannot both become current.
 */
export async function insertReading(
  trx: Knex.Transaction,
  input: {
    specId: string;
    position: number;
    kind: 'install' | 'retorque';
    value: number;
    unit: TorqueUnit;
    stage: number | null;
    wrench: string;
    wrenchId: string | null;
    wrenchCalibratedOn: string | null;
    wrenchCalibrationDueOn: string | null;
    note: string;
    userId: string;
    /** Device time of a reading sent late; null when taken as it arrives. */
    takenAt: string | null;
  },
) {
  // Mark the old one first: the unique index allows one current reading at a time.
  const same = trx('torque_readings')
    .where({ spec_id: input.specId, kind: input.kind, position: input.position })
    .whereNull('superseded_at');
  if (input.stage == null) same.whereNull('stage');
  else same.where('stage', input.stage);
  const previous: { id: string }[] = await same
    .update({ superseded_at: trx.fn.now() })
    .returning('id');
  const [row] = await trx('torque_readings')
    .insert({
      spec_id: input.specId,
      position: input.position,
      kind: input.kind,
      value: input.value,
      unit: input.unit,
      stage: input.stage,
      wrench: input.wrench,
      wrench_id: input.wrenchId,
      wrench_calibrated_on: input.wrenchCalibratedOn,
      wrench_calibration_due_on: input.wrenchCalibrationDueOn,
      note: input.note,
      recorded_by: input.userId,
      taken_at: input.takenAt,
    })
    .returning('id');
  if (previous.length) {
    await trx('torque_readings')
      .whereIn(
        'id',
        previous.map((p) => p.id),
      )
      .update({ superseded_by_id: row.id });
  }
  return { id: row.id as string, supersededId: previous[0]?.id ?? null };
}

/** The highest fastener position that holds a reading (0 when none). */
export async function highestReadPosition(knex: Knex, specId: string): Promise<number> {
  const row = await knex('torque_readings')
    .where({ spec_id: specId })
    .max('position as max')
    .first();
  return Number(row?.max ?? 0);
}

/** The highest stage that holds a reading (0 when none). */
export async function highestReadStage(knex: Knex, specId: string): Promise<number> {
  const row = await knex('torque_readings').where({ spec_id: specId }).max('stage as max').first();
  return Number(row?.max ?? 0);
}

/** Whether a spec has any readings (its torque fields are then the owner's to change). */
export async function specHasReadings(knex: Knex, specId: string) {
  const row = await knex('torque_readings').where({ spec_id: specId }).first('id');
  return Boolean(row);
}
