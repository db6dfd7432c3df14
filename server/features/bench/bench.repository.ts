/**
 * The only place the bench tables are queried: sheets, their test points and
 * values, and the shop's original sheet. A value that was not measured has no
 * row; it comes back as null in its point's list of values.
 */
import type { Knex } from 'knex';
import type {
  BenchOriginalFormat,
  CreateBenchSheetInput,
  FluidTemperatureUnit,
  TestPoint,
  UpdateBenchSheetInput,
} from '@shared/schemas/bench';

type Person = { id: string; name: string };

/** A stored sheet with every point and value; the service decides what leaves. */
export type SheetRecord = {
  id: string;
  buildId: string;
  partId: string;
  partName: string;
  /** The part's shop now: a shop sees a sheet only while the part is sent to it. */
  partShopUserId: string | null;
  occasion: string;
  testedOn: string;
  testedBy: string;
  fluid: string;
  fluidTemperature: { value: number; unit: FluidTemperatureUnit } | null;
  notes: string;
  shopUserId: string | null;
  enteredBy: Person | null;
  updatedBy: Person | null;
  createdAt: string;
  updatedAt: string;
  /** values[p − 1] is position p's value; the list ends at the last position with a value. */
  points: TestPoint[];
  original: OriginalRecord | null;
};

export type OriginalRecord = {
  id: string;
  sheetId: string;
  fileName: string;
  format: BenchOriginalFormat;
  contentType: string;
  bytes: number;
  width: number | null;
  height: number | null;
  originalKey: string;
  webKey: string | null;
  thumbKey: string | null;
  uploadedBy: Person | null;
  createdAt: string;
};

type SheetRow = {
  id: string;
  build_id: string;
  part_id: string;
  part_name: string;
  part_shop_user_id: string | null;
  occasion: string;
  tested_on: string;
  tested_by: string;
  fluid: string;
  fluid_temperature_value: number | null;
  fluid_temperature_unit: FluidTemperatureUnit | null;
  notes: string;
  shop_user_id: string | null;
  created_by: string | null;
  created_by_name: string | null;
  updated_by: string | null;
  updated_by_name: string | null;
  created_at: Date;
  updated_at: Date;
};

type PointRow = {
  id: string;
  sheet_id: string;
  seq: number;
  kind: TestPoint['kind'];
  label: string;
  unit: TestPoint['unit'];
  strokes_per_min: number | null;
  condition: string;
  nominal: number | null;
  tolerance_type: TestPoint['tolerance']['type'];
  tolerance_value: number;
  return_limit: number | null;
};

type ValueRow = { point_id: string; position: number; value: number };

type OriginalRow = {
  id: string;
  sheet_id: string;
  file_name: string;
  format: BenchOriginalFormat;
  content_type: string;
  bytes: number;
  width: number | null;
  height: number | null;
  original_key: string;
  web_key: string | null;
  thumb_key: string | null;
  uploaded_by: string | null;
  uploaded_by_name: string | null;
  created_at: Date;
};

const person = (id: string | null, name: string | null): Person | null =>
  id ? { id, name: name ?? '' } : null;

function toOriginal(r: OriginalRow): OriginalRecord {
  return {
    id: r.id,
    sheetId: r.sheet_id,
    fileName: r.file_name,
    format: r.format,
    contentType: r.content_type,
    bytes: r.bytes,
    width: r.width,
    height: r.height,
    originalKey: r.original_key,
    webKey: r.web_key,
    thumbKey: r.thumb_key,
    uploadedBy: person(r.uploaded_by, r.uploaded_by_name),
    createdAt: r.created_at.toISOString(),
  };
}

function toPoint(r: PointRow, values: ValueRow[]): TestPoint {
  const list: (number | null)[] = [];
  for (const v of values) {
    while (list.length < v.position - 1) list.push(null);
    list[v.position - 1] = v.value;
  }
  const point: TestPoint = {
    kind: r.kind,
    label: r.label,
    unit: r.unit,
    strokesPerMin: r.strokes_per_min,
    condition: r.condition,
    nominal: r.nominal,
    tolerance: { type: r.tolerance_type, value: r.tolerance_value },
    returnLimit: r.return_limit,
    values: list,
  };
  return point;
}

function base(knex: Knex, buildId: string) {
  return knex('bench_sheets as s')
    .join('parts as p', 'p.id', 's.part_id')
    .leftJoin('users as c', 'c.id', 's.created_by')
    .leftJoin('users as u', 'u.id', 's.updated_by')
    .where('s.build_id', buildId)
    .select(
      's.*',
      'p.name as part_name',
      'p.shop_user_id as part_shop_user_id',
      'c.display_name as created_by_name',
      'u.display_name as updated_by_name',
    );
}

/** Sheet rows with their points, values and originals, in a fixed number of queries. */
async function assemble(knex: Knex, rows: SheetRow[]): Promise<SheetRecord[]> {
  if (!rows.length) return [];
  const ids = rows.map((r) => r.id);
  const points: PointRow[] = await knex('bench_test_points')
    .whereIn('sheet_id', ids)
    .orderBy([{ column: 'sheet_id' }, { column: 'seq' }]);
  const values: ValueRow[] = points.length
    ? await knex('bench_values')
        .whereIn(
          'point_id',
          points.map((p) => p.id),
        )
        .orderBy([{ column: 'point_id' }, { column: 'position' }])
    : [];
  const originals: OriginalRow[] = await knex('bench_sheet_originals as o')
    .leftJoin('users as u', 'u.id', 'o.uploaded_by')
    .whereIn('o.sheet_id', ids)
    .select('o.*', 'u.display_name as uploaded_by_name');

  const valuesOf = new Map<string, ValueRow[]>();
  for (const v of values) valuesOf.set(v.point_id, [...(valuesOf.get(v.point_id) ?? []), v]);
  const pointsOf = new Map<string, TestPoint[]>();
  for (const p of points) {
    pointsOf.set(p.sheet_id, [
      ...(pointsOf.get(p.sheet_id) ?? []),
      toPoint(p, valuesOf.get(p.id) ?? []),
    ]);
  }
  const originalOf = new Map(originals.map((o) => [o.sheet_id, toOriginal(o)]));

  return rows.map((r) => ({
    id: r.id,
    buildId: r.build_id,
    partId: r.part_id,
    partName: r.part_name,
    partShopUserId: r.part_shop_user_id,
    occasion: r.occasion,
    testedOn: r.tested_on,
    testedBy: r.tested_by,
    fluid: r.fluid,
    fluidTemperature:
      r.fluid_temperature_value !== null && r.fluid_temperature_unit !== null
        ? { value: r.fluid_temperature_value, unit: r.fluid_temperature_unit }
        : null,
    notes: r.notes,
    shopUserId: r.shop_user_id,
    enteredBy: person(r.created_by, r.created_by_name),
    updatedBy: person(r.updated_by, r.updated_by_name),
    createdAt: r.created_at.toISOString(),
    updatedAt: r.updated_at.toISOString(),
    points: pointsOf.get(r.id) ?? [],
    original: originalOf.get(r.id) ?? null,
  }));
}

export type SheetFilter = {
  partId?: string;
  /** A shop: only the sheets it entered, of parts that are sent to it. */
  shopUserId?: string;
};

/** Oldest test first, so "as received" comes before "after rebuild". */
export async function listSheets(knex: Knex, buildId: string, filter: SheetFilter = {}) {
  const q = base(knex, buildId).orderBy([
    { column: 's.part_id' },
    { column: 's.tested_on' },
    { column: 's.created_at' },
    { column: 's.id' },
  ]);
  if (filter.partId) q.where('s.part_id', filter.partId);
  if (filter.shopUserId) {
    q.where('s.shop_user_id', filter.shopUserId).where('p.shop_user_id', filter.shopUserId);
  }
  return assemble(knex, await q);
}

export async function findSheet(knex: Knex, buildId: string, sheetId: string) {
  const row: SheetRow | undefined = await base(knex, buildId).where('s.id', sheetId).first();
  return row ? (await assemble(knex, [row]))[0] : undefined;
}

type SheetFields = Omit<UpdateBenchSheetInput, 'points'>;

function toRow(input: SheetFields) {
  const row: Record<string, unknown> = {};
  if (input.partId !== undefined) row.part_id = input.partId;
  if (input.occasion !== undefined) row.occasion = input.occasion;
  if (input.testedOn !== undefined) row.tested_on = input.testedOn;
  if (input.testedBy !== undefined) row.tested_by = input.testedBy;
  if (input.fluid !== undefined) row.fluid = input.fluid;
  if (input.notes !== undefined) row.notes = input.notes;
  if (input.fluidTemperature !== undefined) {
    row.fluid_temperature_value = input.fluidTemperature?.value ?? null;
    row.fluid_temperature_unit = input.fluidTemperature?.unit ?? null;
  }
  return row;
}

export async function insertSheet(
  knex: Knex,
  buildId: string,
  input: CreateBenchSheetInput,
  by: { userId: string; shopUserId: string | null },
): Promise<string> {
  const { points: _points, ...fields } = input;
  const [row] = await knex('bench_sheets')
    .insert({
      ...toRow(fields),
      build_id: buildId,
      shop_user_id: by.shopUserId,
      created_by: by.userId,
      updated_by: by.userId,
    })
    .returning('id');
  return row.id;
}

/** Changes the sheet's own fields (any may be absent) and marks who changed it. */
export async function updateSheet(knex: Knex, sheetId: string, input: SheetFields, userId: string) {
  await knex('bench_sheets')
    .where({ id: sheetId })
    .update({ ...toRow(input), updated_by: userId, updated_at: knex.fn.now() });
}

/** Replaces every point and value of a sheet. Run inside the transaction of the change. */
export async function replacePoints(knex: Knex, sheetId: string, points: readonly TestPoint[]) {
  await knex('bench_test_points').where({ sheet_id: sheetId }).delete();
  if (!points.length) return;
  const inserted: { id: string; seq: number }[] = await knex('bench_test_points')
    .insert(
      points.map((p, seq) => ({
        sheet_id: sheetId,
        seq,
        kind: p.kind,
        label: p.label,
        unit: p.unit,
        strokes_per_min: p.strokesPerMin ?? null,
        condition: p.condition ?? '',
        nominal: p.nominal ?? null,
        tolerance_type: p.tolerance.type,
        tolerance_value: p.tolerance.value,
        return_limit: p.returnLimit ?? null,
      })),
    )
    .returning(['id', 'seq']);
  const values = inserted.flatMap(({ id, seq }) =>
    points[seq].values.flatMap((value, i) =>
      value === null ? [] : [{ point_id: id, position: i + 1, value }],
    ),
  );
  if (values.length) await knex('bench_values').insert(values);
}

export async function deleteSheet(knex: Knex, sheetId: string) {
  return knex('bench_sheets').where({ id: sheetId }).delete();
}

export type NewOriginal = Omit<OriginalRecord, 'uploadedBy' | 'createdAt'> & {
  buildId: string;
  uploadedBy: string;
};

/**
 * The sheet's one original: any earlier one is deleted in the same statement
 * order (its files are queued by the trigger) and the new one takes its place.
 */
export async function replaceOriginal(knex: Knex, original: NewOriginal) {
  await knex('bench_sheet_originals').where({ sheet_id: original.sheetId }).delete();
  await knex('bench_sheet_originals').insert({
    id: original.id,
    build_id: original.buildId,
    sheet_id: original.sheetId,
    file_name: original.fileName,
    format: original.format,
    content_type: original.contentType,
    bytes: original.bytes,
    width: original.width,
    height: original.height,
    original_key: original.originalKey,
    web_key: original.webKey,
    thumb_key: original.thumbKey,
    uploaded_by: original.uploadedBy,
  });
}

export async function deleteOriginal(knex: Knex, sheetId: string) {
  return knex('bench_sheet_originals').where({ sheet_id: sheetId }).delete();
}

/** Marks a sheet changed (its original was replaced or removed). */
export async function touchSheet(knex: Knex, sheetId: string, userId: string) {
  await knex('bench_sheets')
    .where({ id: sheetId })
    .update({ updated_by: userId, updated_at: knex.fn.now() });
}
