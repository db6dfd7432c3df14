import type { Knex } from 'knex';
import { namedRows } from '@server/lib/named-query';
import type {
  CreatePartInput,
  PartCategory,
  PartStatus,
  RatingUnit,
  UpdatePartInput,
} from '@shared/schemas/parts';

/** camelCase field → snake_case column, for every writable field. */
const columns = {
  category: 'category',
  name: 'name',
  vendor: 'vendor',
  partNumber: 'part_number',
  quantity: 'quantity',
  status: 'status',
  shopUserId: 'shop_user_id',
  turnaroundDays: 'turnaround_days',
  unitPriceCents: 'unit_price_cents',
  labourCents: 'labour_cents',
  shippingCents: 'shipping_cents',
  taxCents: 'tax_cents',
  coreChargeCents: 'core_charge_cents',
  coreRefundCents: 'core_refund_cents',
  orderedOn: 'ordered_on',
  expectedOn: 'expected_on',
  receivedOn: 'received_on',
  sentOutOn: 'sent_out_on',
  backOn: 'back_on',
  installedOn: 'installed_on',
  notes: 'notes',
  ratingValue: 'rating_value',
  ratingUnit: 'rating_unit',
  ratingFor: 'rating_for',
} as const satisfies Record<keyof CreatePartInput, string>;

/** A stored part with every field, money included; the service decides what leaves. */
export type PartRecord = {
  id: string;
  buildId: string;
  category: PartCategory;
  name: string;
  vendor: string;
  partNumber: string;
  quantity: number;
  status: PartStatus;
  shopUserId: string | null;
  shopName: string | null;
  turnaroundDays: number | null;
  unitPriceCents: number;
  labourCents: number;
  shippingCents: number;
  taxCents: number;
  coreChargeCents: number;
  coreRefundCents: number;
  orderedOn: string | null;
  expectedOn: string | null;
  receivedOn: string | null;
  sentOutOn: string | null;
  backOn: string | null;
  installedOn: string | null;
  notes: string;
  ratingValue: number | null;
  ratingUnit: RatingUnit | null;
  ratingFor: string;
  createdAt: string;
  updatedAt: string;
};

type Row = Record<string, unknown> & {
  id: string;
  build_id: string;
  shop_name: string | null;
  /** ISO text, as toISOString() writes it: see isoUtc. */
  created_at: string;
  updated_at: string;
};

/**
 * Written out field by field, not looped over `columns`: an object literal of one
 * fixed shape is several times faster to build and to spread (present()) than keys
 * added in a loop, which matters for a list of 150 parts on every ledger read.
 */
function toRecord(r: Row): PartRecord {
  // Each column as PartRecord types it (pg returns them so: see lib/database.ts).
  const row = r as Row & Record<string, never>;
  return {
    id: row.id,
    buildId: row.build_id,
    category: row.category,
    name: row.name,
    vendor: row.vendor,
    partNumber: row.part_number,
    quantity: row.quantity,
    status: row.status,
    shopUserId: row.shop_user_id,
    shopName: row.shop_name,
    turnaroundDays: row.turnaround_days,
    unitPriceCents: row.unit_price_cents,
    labourCents: row.labour_cents,
    shippingCents: row.shipping_cents,
    taxCents: row.tax_cents,
    coreChargeCents: row.core_charge_cents,
    coreRefundCents: row.core_refund_cents,
    orderedOn: row.ordered_on,
    expectedOn: row.expected_on,
    receivedOn: row.received_on,
    sentOutOn: row.sent_out_on,
    backOn: row.back_on,
    installedOn: row.installed_on,
    notes: row.notes,
    ratingValue: row.rating_value,
    ratingUnit: row.rating_unit,
    ratingFor: row.rating_for,
    createdAt: row.created_at,
    updatedAt: row.updated_at,
  };
}

export function toRow(input: UpdatePartInput) {
  const row: Record<string, unknown> = {};
  for (const [key, column] of Object.entries(columns)) {
    const value = input[key as keyof UpdatePartInput];
    if (value !== undefined) row[column] = value;
  }
  return row;
}

/**
 * A timestamp as the ISO text toISOString() writes (UTC, milliseconds, both truncated), made
 * by PostgreSQL: a list of 150 parts then turns no row into a Date and back.
 */
export const isoUtc = (column: string) =>
  `to_char(${column} at time zone 'UTC', 'YYYY-MM-DD"T"HH24:MI:SS.MS"Z"')`;

/** Every column toRecord reads, written out (a named statement may not select `p.*`). */
const partColumns = [
  'p.id',
  'p.build_id',
  ...Object.values(columns).map((c) => `p.${c}`),
  `${isoUtc('p.created_at')} as created_at`,
  `${isoUtc('p.updated_at')} as updated_at`,
  's.display_name as shop_name',
];

function base(knex: Knex, buildId: string) {
  return knex('parts as p')
    .leftJoin('users as s', 's.id', 'p.shop_user_id')
    .where('p.build_id', buildId)
    .select(partColumns.map((c) => knex.raw(c)));
}

/**
 * The ledger's list, read on every visit: a named statement (planned once per connection).
 * A null shop parameter switches the shop filter off, so one text serves every role.
 */
const listSql = `select ${partColumns.join(', ')}
  from parts p left join users s on s.id = p.shop_user_id
  where p.build_id = ? and (?::uuid is null or p.shop_user_id = ?)
  order by p.category, p.created_at, p.name, p.id`;

export async function listParts(knex: Knex, buildId: string, opts: { shopUserId?: string } = {}) {
  const shop = opts.shopUserId ?? null;
  const rows = await namedRows<Row>(knex, 'parts-list', listSql, [buildId, shop, shop]);
  return rows.map(toRecord);
}

export async function findPart(knex: Knex, buildId: string, partId: string) {
  const row: Row | undefined = await base(knex, buildId).where('p.id', partId).first();
  return row ? toRecord(row) : undefined;
}

export async function insertParts(knex: Knex, buildId: string, inputs: CreatePartInput[]) {
  if (inputs.length === 0) return [] as string[];
  const rows = await knex('parts')
    .insert(inputs.map((input) => ({ ...toRow(input), build_id: buildId })))
    .returning('id');
  return rows.map((r: { id: string }) => r.id);
}

export async function updatePart(
  knex: Knex,
  buildId: string,
  partId: string,
  input: UpdatePartInput,
) {
  await knex('parts')
    .where({ id: partId, build_id: buildId })
    .update({ ...toRow(input), updated_at: knex.fn.now() });
}

export async function deletePart(knex: Knex, buildId: string, partId: string) {
  return knex('parts').where({ id: partId, build_id: buildId }).delete();
}

/** Shop members of a build by user id, to check a part is sent to a real shop member. */
export async function shopMembers(knex: Knex, buildId: string) {
  const rows: { user_id: string; email: string; display_name: string }[] = await knex(
    'build_members as m',
  )
    .join('users as u', 'u.id', 'm.user_id')
    .where({ 'm.build_id': buildId, 'm.role': 'shop' })
    .select('m.user_id', 'u.email', 'u.display_name');
  return rows;
}

// ---- overdue send-outs ------------------------------------------------------------------

export type OverduePart = {
  id: string;
  buildId: string;
  name: string;
  category: PartRecord['category'];
  partNumber: string;
  shopUserId: string | null;
  shopName: string | null;
  sentOutOn: string;
  turnaroundDays: number;
  dueOn: string;
  /** The build's IANA zone, or null (UTC) until its owner chooses one. */
  timeZone: string | null;
};

const overdueColumns = (knex: Knex) => [
  'p.id',
  'p.build_id',
  'p.name',
  'p.category',
  'p.part_number',
  'p.shop_user_id',
  's.display_name as shop_name',
  'p.sent_out_on',
  'p.turnaround_days',
  knex.raw(`to_char(p.sent_out_on + p.turnaround_days, 'YYYY-MM-DD') as due_on`),
  'b.time_zone',
];

type OverdueRow = {
  id: string;
  build_id: string;
  name: string;
  category: PartRecord['category'];
  part_number: string;
  shop_user_id: string | null;
  shop_name: string | null;
  sent_out_on: string;
  turnaround_days: number;
  due_on: string;
  time_zone: string | null;
};

const toOverdue = (r: OverdueRow): OverduePart => ({
  id: r.id,
  buildId: r.build_id,
  name: r.name,
  category: r.category,
  partNumber: r.part_number,
  shopUserId: r.shop_user_id,
  shopName: r.shop_name,
  sentOutOn: r.sent_out_on,
  turnaroundDays: r.turnaround_days,
  dueOn: r.due_on,
  timeZone: r.time_zone,
});

/** At a shop, past sent-out date + turnaround on `today`, with no notice yet for this spell. */
function overdue(knex: Knex, today: string) {
  return knex('parts as p')
    .join('builds as b', 'b.id', 'p.build_id')
    .leftJoin('users as s', 's.id', 'p.shop_user_id')
    .where('p.status', 'at-shop')
    .whereNotNull('p.sent_out_on')
    .whereNotNull('p.turnaround_days')
    .whereRaw('p.sent_out_on + p.turnaround_days < ?::date', [today])
    .whereNotExists(
      knex('part_overdue_notices as n')
        .whereRaw('n.part_id = p.id')
        .whereRaw('n.sent_out_on = p.sent_out_on')
        .whereRaw('n.due_on = p.sent_out_on + p.turnaround_days'),
    );
}

/** Every part overdue on `today` whose spell nobody has been told of, oldest due first. */
export async function overdueUntold(knex: Knex, today: string, limit = 500) {
  const rows: OverdueRow[] = await overdue(knex, today)
    .orderByRaw('p.sent_out_on + p.turnaround_days')
    .limit(limit)
    .select(overdueColumns(knex));
  return rows.map(toOverdue);
}

/** The part, locked for the transaction, if it is still overdue and untold on `today`. */
export async function lockOverdue(trx: Knex.Transaction, partId: string, today: string) {
  const row: OverdueRow | undefined = await overdue(trx, today)
    .where('p.id', partId)
    .forUpdate('p')
    .first(overdueColumns(trx));
  return row ? toOverdue(row) : undefined;
}

/** Records that this spell was told; false when another process got there first. */
export async function recordOverdueNotice(trx: Knex.Transaction, part: OverduePart) {
  const rows = await trx('part_overdue_notices')
    .insert({ part_id: part.id, sent_out_on: part.sentOutOn, due_on: part.dueOn })
    .onConflict(['part_id', 'sent_out_on', 'due_on'])
    .ignore()
    .returning('part_id');
  return rows.length > 0;
}
