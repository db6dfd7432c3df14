/** The only place dyno_runs is queried. */
import type { Knex } from 'knex';
import type {
  CurveRow,
  DynoAttachmentKind,
  DynoRun,
  RunStatus,
  RunUnits,
  WeatherFields,
} from '@shared/schemas/dyno';
import { sortCurve } from '@shared/dyno';
import { person, weatherFromRow, weatherToRow, type WeatherRow } from './rows';

/** A curve row as stored: `[rpm, power, torque, boost, egt, mixture]`, null where not logged. */
type StoredCurveRow = [
  number,
  number | null,
  number | null,
  number | null,
  number | null,
  number | null,
];

type RunRow = WeatherRow & {
  id: string;
  build_id: string;
  session_id: string;
  run_number: number;
  status: RunStatus;
  abort_reason: string | null;
  gear: string;
  tune_revision: string;
  notes: string;
  power_unit: RunUnits['powerUnit'];
  torque_unit: RunUnits['torqueUnit'];
  boost_unit: RunUnits['boostUnit'];
  egt_unit: RunUnits['egtUnit'];
  mixture_kind: RunUnits['mixtureKind'];
  peak_power: number | null;
  peak_power_rpm: number | null;
  peak_torque: number | null;
  peak_torque_rpm: number | null;
  boost: number | null;
  egt: number | null;
  mixture: number | null;
  curve: StoredCurveRow[] | null;
  curve_rows: number;
  attachment_key: string | null;
  attachment_name: string | null;
  attachment_kind: DynoAttachmentKind | null;
  attachment_content_type: string | null;
  attachment_bytes: number | null;
  created_by: string | null;
  created_by_name: string | null;
  created_at: Date;
  updated_at: Date;
};

/** A run with where its attachment lives; the key never leaves the server (see present). */
export type RunRecord = DynoRun & { attachmentKey: string | null };

function toRun(r: RunRow): RunRecord {
  return {
    id: r.id,
    buildId: r.build_id,
    sessionId: r.session_id,
    runNumber: r.run_number,
    status: r.status,
    abortReason: r.abort_reason,
    gear: r.gear,
    tuneRevision: r.tune_revision,
    notes: r.notes,
    powerUnit: r.power_unit,
    torqueUnit: r.torque_unit,
    boostUnit: r.boost_unit,
    egtUnit: r.egt_unit,
    mixtureKind: r.mixture_kind,
    peakPower: r.peak_power,
    peakPowerRpm: r.peak_power_rpm,
    peakTorque: r.peak_torque,
    peakTorqueRpm: r.peak_torque_rpm,
    boost: r.boost,
    egt: r.egt,
    mixture: r.mixture,
    weather: weatherFromRow(r),
    curve: (r.curve ?? []).map(([rpm, power, torque, boost, egt, mixture]) => ({
      rpm,
      power,
      torque,
      boost,
      egt,
      mixture,
    })),
    attachment:
      r.attachment_key && r.attachment_name && r.attachment_kind && r.attachment_content_type
        ? {
            name: r.attachment_name,
            kind: r.attachment_kind,
            contentType: r.attachment_content_type,
            bytes: r.attachment_bytes ?? 0,
            url: `/api/builds/${r.build_id}/dyno-runs/${r.id}/attachment`,
          }
        : null,
    createdBy: person(r.created_by, r.created_by_name),
    createdAt: r.created_at.toISOString(),
    updatedAt: r.updated_at.toISOString(),
    attachmentKey: r.attachment_key,
  };
}

/** The public shape: the storage key stays on the server. */
export function present(r: RunRecord): DynoRun {
  const { attachmentKey: _key, ...run } = r;
  return run;
}

function runs(knex: Knex, buildId: string) {
  return knex('dyno_runs as r')
    .leftJoin('users as u', 'u.id', 'r.created_by')
    .where('r.build_id', buildId)
    .select('r.*', 'u.display_name as created_by_name');
}

/** Runs of some sessions, in pull order. */
export async function listRuns(knex: Knex, buildId: string, sessionIds: string[]) {
  if (sessionIds.length === 0) return [];
  const rows: RunRow[] = await runs(knex, buildId)
    .whereIn('r.session_id', sessionIds)
    .orderBy([{ column: 'r.session_id' }, { column: 'r.run_number' }]);
  return rows.map(toRun);
}

export async function findRun(knex: Knex, buildId: string, runId: string) {
  const row: RunRow | undefined = await runs(knex, buildId).where('r.id', runId).first();
  return row ? toRun(row) : undefined;
}

/** Every stored field of a run (its attachment aside), as the service has checked it. */
export type RunValues = RunUnits & {
  status: RunStatus;
  abortReason: string | null;
  gear: string;
  tuneRevision: string;
  notes: string;
  peakPower: number | null;
  peakPowerRpm: number | null;
  peakTorque: number | null;
  peakTorqueRpm: number | null;
  boost: number | null;
  egt: number | null;
  mixture: number | null;
  weather: WeatherFields | null;
  curve: CurveRow[];
};

function toColumns(v: RunValues) {
  const curve = sortCurve(v.curve);
  return {
    status: v.status,
    abort_reason: v.status === 'aborted' ? v.abortReason : null,
    gear: v.gear,
    tune_revision: v.tuneRevision,
    notes: v.notes,
    power_unit: v.powerUnit,
    torque_unit: v.torqueUnit,
    boost_unit: v.boostUnit,
    egt_unit: v.egtUnit,
    mixture_kind: v.mixtureKind,
    peak_power: v.peakPower,
    peak_power_rpm: v.peakPowerRpm,
    peak_torque: v.peakTorque,
    peak_torque_rpm: v.peakTorqueRpm,
    boost: v.boost,
    egt: v.egt,
    mixture: v.mixture,
    ...weatherToRow(v.weather),
    // A JSON string: knex would otherwise send a JS array as a PostgreSQL array.
    curve: curve.length
      ? JSON.stringify(
          curve.map((r): StoredCurveRow => [r.rpm, r.power, r.torque, r.boost, r.egt, r.mixture]),
        )
      : null,
    curve_rows: curve.length,
  };
}

/** The next pull number of a session; call with the session locked (lockSession). */
export async function nextRunNumber(trx: Knex.Transaction, sessionId: string): Promise<number> {
  const row = await trx('dyno_runs')
    .where({ session_id: sessionId })
    .max('run_number as max')
    .first();
  return Number(row?.max ?? 0) + 1;
}

export async function insertRun(
  trx: Knex.Transaction,
  buildId: string,
  sessionId: string,
  runNumber: number,
  values: RunValues,
  createdBy: string,
): Promise<string> {
  const [row] = await trx('dyno_runs')
    .insert({
      build_id: buildId,
      session_id: sessionId,
      run_number: runNumber,
      created_by: createdBy,
      ...toColumns(values),
    })
    .returning('id');
  return row.id;
}

export async function updateRun(knex: Knex, runId: string, values: RunValues) {
  await knex('dyno_runs')
    .where({ id: runId })
    .update({ ...toColumns(values), updated_at: knex.fn.now() });
}

/** Locks the run's row for the rest of the transaction; false when it was deleted meanwhile. */
export async function lockRun(trx: Knex.Transaction, runId: string): Promise<boolean> {
  return Boolean(await trx('dyno_runs').where({ id: runId }).forUpdate().first('id'));
}

export type AttachmentValues = {
  key: string;
  name: string;
  kind: DynoAttachmentKind;
  contentType: string;
  bytes: number;
};

/** Sets (or clears) a run's attachment; the file it replaces is queued for removal by trigger. */
export async function setAttachment(knex: Knex, runId: string, a: AttachmentValues | null) {
  await knex('dyno_runs')
    .where({ id: runId })
    .update({
      attachment_key: a?.key ?? null,
      attachment_name: a?.name ?? null,
      attachment_kind: a?.kind ?? null,
      attachment_content_type: a?.contentType ?? null,
      attachment_bytes: a?.bytes ?? null,
      updated_at: knex.fn.now(),
    });
}

/** Deletes a run; its attachment is queued for removal by trigger in the same statement. */
export async function deleteRun(knex: Knex, runId: string) {
  return knex('dyno_runs').where({ id: runId }).delete();
}
