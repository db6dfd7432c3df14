import type { Knex } from 'knex';
import type {
  CreatePartInput,
  PartCategory,
  PartStatus,
  RatingUnit,
  UpdatePartInput,
} from '../../../shared/schemas/parts';

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
  created_at: Date;
  updated_at: Date;
};

function toRecord(row: Row): PartRecord {
  const out: Record<string, unknown> = {
    id: row.id,
    buildId: row.build_id,
    shopName: row.shop_name,
    createdAt: row.created_at.toISOString(),
    updatedAt: row.updated_at.toISOString(),
  };
  for (const [key, column] of Object.entries(columns)) out[key] = row[column];
  return out as PartRecord;
}

export function toRow(input: UpdatePartInput) {
  const row: Record<string, unknown> = {};
  for (const [key, column] of Object.entries(columns)) {
    const value = input[key as keyof UpdatePartInput];
    if (value !== undefined) row[column] = value;
  }
  return row;
}

function base(knex: Knex, buildId: string) {
  return knex('parts as p')
    .leftJoin('users as s', 's.id', 'p.shop_user_id')
    .where('p.build_id', buildId)
    .select('p.*', 's.display_name as shop_name');
}

export async function listParts(knex: Knex, buildId: string, opts: { shopUserId?: string } = {}) {
  const q = base(knex, buildId).orderBy([
    { column: 'p.category' },
    { column: 'p.created_at' },
    { column: 'p.name' },
    { column: 'p.id' },
  ]);
  if (opts.shopUserId) q.where('p.shop_user_id', opts.shopUserId);
  const rows: Row[] = await q;
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
