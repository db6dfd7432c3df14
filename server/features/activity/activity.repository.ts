/**
 * Recent events of a build, read from the tables where they are recorded (parts' dates,
 * steps' sign-offs, photos, bench sheets): one statement each, newest first, at most
 * `limit` of each. `shopUserId` narrows every statement to what that shop may see.
 */
import type { Knex } from 'knex';
import { wallClock } from '@shared/dates';
import type { ActivityEvent, ActivityKind } from '@shared/schemas/activity';

type Filter = {
  buildId: string;
  shopUserId?: string;
  /** The build's zone: a moment's day is its date there. */
  timeZone: string;
  today: string;
  limit: number;
};

const person = (id: string | null, name: string | null) => (id ? { id, name: name ?? '' } : null);

/** A part's dates as events: ordered, arrived, out to its shop, back, installed. */
export async function partEvents(knex: Knex, f: Filter): Promise<ActivityEvent[]> {
  const q = knex('parts as p')
    .leftJoin('users as s', 's.id', 'p.shop_user_id')
    .joinRaw(
      `cross join lateral (values
        ('part-ordered', p.ordered_on), ('part-arrived', p.received_on),
        ('part-sent-out', p.sent_out_on), ('part-back', p.back_on),
        ('part-installed', p.installed_on)) as e(kind, day)`,
    )
    .where('p.build_id', f.buildId)
    .whereNotNull('e.day')
    .where('e.day', '<=', f.today)
    .orderBy('e.day', 'desc')
    .limit(f.limit)
    .select(
      'p.id',
      'p.name',
      's.display_name as shop_name',
      'e.kind',
      knex.raw(`to_char(e.day, 'YYYY-MM-DD') as day`),
    );
  if (f.shopUserId) q.where('p.shop_user_id', f.shopUserId);
  const rows: {
    id: string;
    name: string;
    shop_name: string | null;
    kind: ActivityKind;
    day: string;
  }[] = await q;
  return rows.map((r) => ({
    kind: r.kind,
    day: r.day,
    at: null,
    subject: { type: 'part', id: r.id, name: r.name },
    by: null,
    ...(r.shop_name && (r.kind === 'part-sent-out' || r.kind === 'part-back')
      ? { shopName: r.shop_name }
      : {}),
  }));
}

/** Steps visible to a shop: those linked to a part sent to it. */
function stepVisibleToShop(knex: Knex, stepColumn: string, shopUserId: string) {
  return knex('install_step_parts as sp')
    .join('parts as vp', 'vp.id', 'sp.part_id')
    .whereRaw(`sp.step_id = ${stepColumn}`)
    .where('vp.shop_user_id', shopUserId);
}

export async function signOffEvents(knex: Knex, f: Filter): Promise<ActivityEvent[]> {
  const q = knex('install_steps as st')
    .leftJoin('users as u', 'u.id', 'st.signed_off_by')
    .where('st.build_id', f.buildId)
    .whereNotNull('st.signed_off_at')
    .orderBy('st.signed_off_at', 'desc')
    .limit(f.limit)
    .select(
      'st.id',
      'st.title',
      'st.signed_off_at',
      'st.signed_off_by',
      'u.display_name',
      knex.raw('st.override_reason is not null as overridden'),
    );
  if (f.shopUserId) q.whereExists(stepVisibleToShop(knex, 'st.id', f.shopUserId));
  const rows: {
    id: string;
    title: string;
    signed_off_at: Date;
    signed_off_by: string | null;
    display_name: string | null;
    overridden: boolean;
  }[] = await q;
  return rows.map((r) => ({
    kind: 'step-signed-off',
    day: wallClock(r.signed_off_at, f.timeZone).date,
    at: r.signed_off_at.toISOString(),
    subject: { type: 'step', id: r.id, name: r.title },
    by: person(r.signed_off_by, r.display_name),
    overridden: r.overridden,
  }));
}

/** Photos added to one step or part by one person on one day count as one event. */
export async function photoEvents(knex: Knex, f: Filter): Promise<ActivityEvent[]> {
  const q = knex('photos as ph')
    .leftJoin('install_steps as st', 'st.id', 'ph.step_id')
    .leftJoin('parts as pa', 'pa.id', 'ph.part_id')
    .leftJoin('users as u', 'u.id', 'ph.uploaded_by')
    .where('ph.build_id', f.buildId)
    .groupBy('ph.step_id', 'st.title', 'ph.part_id', 'pa.name', 'ph.uploaded_by', 'u.display_name')
    .groupByRaw(`(ph.created_at at time zone 'UTC')::date`)
    .orderBy('at', 'desc')
    .limit(f.limit)
    .select(
      'ph.step_id',
      'st.title as step_title',
      'ph.part_id',
      'pa.name as part_name',
      'ph.uploaded_by',
      'u.display_name',
      knex.raw('count(*)::int as count'),
      knex.raw('max(ph.created_at) as at'),
    );
  if (f.shopUserId) {
    const shop = f.shopUserId;
    q.where((w) =>
      w.where('pa.shop_user_id', shop).orWhereExists(stepVisibleToShop(knex, 'ph.step_id', shop)),
    );
  }
  const rows: {
    step_id: string | null;
    step_title: string | null;
    part_id: string | null;
    part_name: string | null;
    uploaded_by: string | null;
    display_name: string | null;
    count: number;
    at: Date;
  }[] = await q;
  return rows.map((r) => ({
    kind: 'photos-added',
    day: wallClock(r.at, f.timeZone).date,
    at: r.at.toISOString(),
    subject: r.step_id
      ? { type: 'step', id: r.step_id, name: r.step_title ?? '' }
      : { type: 'part', id: r.part_id!, name: r.part_name ?? '' },
    by: person(r.uploaded_by, r.display_name),
    count: r.count,
  }));
}

/** Bench sheets entered; a shop sees only the sheets it entered of parts sent to it. */
export async function benchEvents(knex: Knex, f: Filter): Promise<ActivityEvent[]> {
  const q = knex('bench_sheets as b')
    .join('parts as p', 'p.id', 'b.part_id')
    .leftJoin('users as u', 'u.id', 'b.created_by')
    .where('b.build_id', f.buildId)
    .orderBy('b.created_at', 'desc')
    .limit(f.limit)
    .select('p.id', 'p.name', 'b.occasion', 'b.created_at', 'b.created_by', 'u.display_name');
  if (f.shopUserId) q.where({ 'b.shop_user_id': f.shopUserId, 'p.shop_user_id': f.shopUserId });
  const rows: {
    id: string;
    name: string;
    occasion: string;
    created_at: Date;
    created_by: string | null;
    display_name: string | null;
  }[] = await q;
  return rows.map((r) => ({
    kind: 'bench-sheet-added',
    day: wallClock(r.created_at, f.timeZone).date,
    at: r.created_at.toISOString(),
    subject: { type: 'part', id: r.id, name: r.name },
    by: person(r.created_by, r.display_name),
    occasion: r.occasion,
  }));
}
