/** The only place dyno_sessions is queried. */
import type { Knex } from 'knex';
import {
  basisForDynoKind,
  type DynoKind,
  type DynoSession,
  type WeatherFields,
} from '@shared/schemas/dyno';
import { person, weatherFromRow, weatherToRow, type WeatherRow } from './rows';

type SessionRow = WeatherRow & {
  id: string;
  build_id: string;
  session_date: string;
  place: string;
  dyno_kind: DynoKind;
  run_by: string;
  notes: string;
  shop_user_id: string | null;
  shop_name: string | null;
  created_by: string | null;
  created_by_name: string | null;
  run_count: number;
  created_at: Date;
  updated_at: Date;
};

function toSession(r: SessionRow): DynoSession {
  return {
    id: r.id,
    buildId: r.build_id,
    date: r.session_date,
    place: r.place,
    dynoKind: r.dyno_kind,
    basis: basisForDynoKind[r.dyno_kind],
    runBy: r.run_by,
    notes: r.notes,
    weather: weatherFromRow(r),
    shop: person(r.shop_user_id, r.shop_name),
    runCount: Number(r.run_count),
    createdBy: person(r.created_by, r.created_by_name),
    createdAt: r.created_at.toISOString(),
    updatedAt: r.updated_at.toISOString(),
  };
}

/** Which sessions a caller may see: all of a build's, or only those assigned to one shop. */
export type SessionFilter = { shopUserId?: string };

function sessions(knex: Knex, buildId: string, filter: SessionFilter) {
  const q = knex('dyno_sessions as s')
    .leftJoin('users as shop', 'shop.id', 's.shop_user_id')
    .leftJoin('users as u', 'u.id', 's.created_by')
    .where('s.build_id', buildId)
    .select(
      's.*',
      'shop.display_name as shop_name',
      'u.display_name as created_by_name',
      knex('dyno_runs as r').whereRaw('r.session_id = s.id').count('*').as('run_count'),
    );
  if (filter.shopUserId) q.where('s.shop_user_id', filter.shopUserId);
  return q;
}

/** Newest dyno day first. */
export async function listSessions(knex: Knex, buildId: string, filter: SessionFilter) {
  const rows: SessionRow[] = await sessions(knex, buildId, filter).orderBy([
    { column: 's.session_date', order: 'desc' },
    { column: 's.created_at', order: 'desc' },
    { column: 's.id', order: 'desc' },
  ]);
  return rows.map(toSession);
}

export async function findSession(
  knex: Knex,
  buildId: string,
  sessionId: string,
  filter: SessionFilter,
) {
  const row: SessionRow | undefined = await sessions(knex, buildId, filter)
    .where('s.id', sessionId)
    .first();
  return row ? toSession(row) : undefined;
}

export type SessionValues = {
  date?: string;
  place?: string;
  dynoKind?: DynoKind;
  runBy?: string;
  notes?: string;
  weather?: WeatherFields | null;
  shopUserId?: string | null;
};

function toColumns(v: SessionValues) {
  return {
    ...(v.date !== undefined ? { session_date: v.date } : {}),
    ...(v.place !== undefined ? { place: v.place } : {}),
    ...(v.dynoKind !== undefined ? { dyno_kind: v.dynoKind } : {}),
    ...(v.runBy !== undefined ? { run_by: v.runBy } : {}),
    ...(v.notes !== undefined ? { notes: v.notes } : {}),
    ...(v.weather !== undefined ? weatherToRow(v.weather) : {}),
    ...(v.shopUserId !== undefined ? { shop_user_id: v.shopUserId } : {}),
  };
}

export async function insertSession(
  knex: Knex,
  buildId: string,
  values: SessionValues & { date: string; dynoKind: DynoKind; createdBy: string },
): Promise<string> {
  const [row] = await knex('dyno_sessions')
    .insert({ build_id: buildId, created_by: values.createdBy, ...toColumns(values) })
    .returning('id');
  return row.id;
}

export async function updateSession(knex: Knex, sessionId: string, values: SessionValues) {
  await knex('dyno_sessions')
    .where({ id: sessionId })
    .update({ ...toColumns(values), updated_at: knex.fn.now() });
}

/**
 * Locks the session's row for the rest of the transaction (run numbers are
 * handed out under it); false when it was deleted meanwhile.
 */
export async function lockSession(trx: Knex.Transaction, sessionId: string): Promise<boolean> {
  const row = await trx('dyno_sessions').where({ id: sessionId }).forUpdate().first('id');
  return Boolean(row);
}

/** Deletes the session and its runs by cascade; their files are queued by trigger in the same statement. */
export async function deleteSession(knex: Knex, sessionId: string) {
  return knex('dyno_sessions').where({ id: sessionId }).delete();
}
