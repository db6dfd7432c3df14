/** The only place the install log's tables are queried; snake_case rows ↔ camelCase records. */
import type { Knex } from 'knex';
import type { TorqueUnit } from '../../../shared/install-log/torque';
import type { Person, StepStatus, ThreadCondition } from '../../../shared/schemas/install-log';
import type { SignOffBlocker } from '../../../shared/install-log/sign-off';

const iso = (d: Date | null) => (d ? d.toISOString() : null);
const person = (id: string | null, name: string | null): Person | null =>
  id ? { id, name: name ?? '' } : null;

// ---- ordering -----------------------------------------------------------------

type Ordered = 'install_jobs' | 'install_steps' | 'install_checklist_items' | 'fastener_specs';
const parentOf: Record<Ordered, { column: string; table: string }> = {
  install_jobs: { column: 'build_id', table: 'builds' },
  install_steps: { column: 'job_id', table: 'install_jobs' },
  install_checklist_items: { column: 'step_id', table: 'install_steps' },
  fastener_specs: { column: 'step_id', table: 'install_steps' },
};

/**
 * Locks the parent row so two writers cannot number siblings at the same time.
 * Call inside a transaction before counting or renumbering.
 */
export async function lockParent(trx: Knex.Transaction, table: Ordered, parentId: string) {
  const parent = parentOf[table];
  await trx(parent.table).where({ id: parentId }).forUpdate().first('id');
}

export async function nextPosition(trx: Knex.Transaction, table: Ordered, parentId: string) {
  const row = await trx(table)
    .where(parentOf[table].column, parentId)
    .max<{ max: number | null }>('position as max')
    .first();
  return (row?.max ?? 0) + 1;
}

/** Moves one row to a 1-based place among its siblings and renumbers them 1..n. */
export async function moveTo(
  trx: Knex.Transaction,
  table: Ordered,
  parentId: string,
  id: string,
  position: number,
) {
  const rows: { id: string }[] = await trx(table)
    .where(parentOf[table].column, parentId)
    .orderBy([{ column: 'position' }, { column: 'created_at' }, { column: 'id' }])
    .select('id');
  const ids = rows.map((r) => r.id).filter((x) => x !== id);
  ids.splice(Math.max(0, Math.min(position - 1, ids.length)), 0, id);
  for (const [i, rowId] of ids.entries()) {
    await trx(table)
      .where({ id: rowId })
      .whereNot({ position: i + 1 })
      .update({ position: i + 1 });
  }
}

/** Renumbers the siblings 1..n after a delete, keeping their order. */
export async function closeGaps(trx: Knex.Transaction, table: Ordered, parentId: string) {
  const rows: { id: string; position: number }[] = await trx(table)
    .where(parentOf[table].column, parentId)
    .orderBy([{ column: 'position' }, { column: 'created_at' }, { column: 'id' }])
    .select('id', 'position');
  for (const [i, r] of rows.entries()) {
    if (r.position !== i + 1)
      await trx(table)
        .where({ id: r.id })
        .update({ position: i + 1 });
  }
}

// ---- jobs -------------------------------------------------------------------

type JobRow = {
  id: string;
  build_id: string;
  position: number;
  title: string;
  notes: string;
  created_by: string | null;
  created_by_name: string | null;
  created_at: Date;
  updated_at: Date;
};

function toJob(r: JobRow) {
  return {
    id: r.id,
    buildId: r.build_id,
    position: r.position,
    title: r.title,
    notes: r.notes,
    createdBy: person(r.created_by, r.created_by_name),
    createdAt: r.created_at.toISOString(),
    updatedAt: r.updated_at.toISOString(),
  };
}
export type JobRecord = ReturnType<typeof toJob>;

function jobs(knex: Knex, buildId: string) {
  return knex('install_jobs as j')
    .leftJoin('users as u', 'u.id', 'j.created_by')
    .where('j.build_id', buildId)
    .select('j.*', 'u.display_name as created_by_name');
}

export async function listJobs(knex: Knex, buildId: string) {
  const rows: JobRow[] = await jobs(knex, buildId).orderBy([
    { column: 'j.position' },
    { column: 'j.created_at' },
  ]);
  return rows.map(toJob);
}

export async function findJob(knex: Knex, buildId: string, jobId: string) {
  const row: JobRow | undefined = await jobs(knex, buildId).where('j.id', jobId).first();
  return row ? toJob(row) : undefined;
}

export async function insertJob(
  trx: Knex.Transaction,
  buildId: string,
  input: { title: string; notes?: string; position: number; createdBy: string },
) {
  const [row] = await trx('install_jobs')
    .insert({
      build_id: buildId,
      title: input.title,
      notes: input.notes ?? '',
      position: input.position,
      created_by: input.createdBy,
    })
    .returning('id');
  return row.id as string;
}

export async function updateJob(
  knex: Knex,
  jobId: string,
  input: { title?: string; notes?: string },
) {
  const row: Record<string, unknown> = {};
  if (input.title !== undefined) row.title = input.title;
  if (input.notes !== undefined) row.notes = input.notes;
  await knex('install_jobs')
    .where({ id: jobId })
    .update({ ...row, updated_at: knex.fn.now() });
}

export async function deleteJob(knex: Knex, jobId: string) {
  await knex('install_jobs').where({ id: jobId }).delete();
}

// ---- steps --------------------------------------------------------------------

type StepRow = {
  id: string;
  build_id: string;
  job_id: string;
  position: number;
  title: string;
  description: string;
  lifts_vehicle: boolean;
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
  input: { title: string; description?: string; liftsVehicle?: boolean; position: number },
) {
  const [row] = await trx('install_steps')
    .insert({
      build_id: buildId,
      job_id: jobId,
      title: input.title,
      description: input.description ?? '',
      lifts_vehicle: input.liftsVehicle ?? false,
      position: input.position,
    })
    .returning('id');
  return row.id as string;
}

export async function updateStep(
  knex: Knex,
  stepId: string,
  input: { title?: string; description?: string; liftsVehicle?: boolean; status?: StepStatus },
) {
  const row: Record<string, unknown> = {};
  if (input.title !== undefined) row.title = input.title;
  if (input.description !== undefined) row.description = input.description;
  if (input.liftsVehicle !== undefined) row.lifts_vehicle = input.liftsVehicle;
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

// ---- step ↔ parts ---------------------------------------------------------------

export type StepPartLink = {
  stepId: string;
  id: string;
  name: string;
  category: string;
  status: string;
  shopUserId: string | null;
};

export async function listStepParts(knex: Knex, stepIds: string[]): Promise<StepPartLink[]> {
  if (!stepIds.length) return [];
  const rows: {
    step_id: string;
    id: string;
    name: string;
    category: string;
    status: string;
    shop_user_id: string | null;
  }[] = await knex('install_step_parts as sp')
    .join('parts as p', 'p.id', 'sp.part_id')
    .whereIn('sp.step_id', stepIds)
    .orderBy([{ column: 'p.category' }, { column: 'p.name' }])
    .select('sp.step_id', 'p.id', 'p.name', 'p.category', 'p.status', 'p.shop_user_id');
  return rows.map((r) => ({
    stepId: r.step_id,
    id: r.id,
    name: r.name,
    category: r.category,
    status: r.status,
    shopUserId: r.shop_user_id,
  }));
}

/** How many of these part ids are parts of the build (to refuse another build's parts). */
export async function countBuildParts(knex: Knex, buildId: string, partIds: string[]) {
  if (!partIds.length) return 0;
  const row = await knex('parts')
    .where({ build_id: buildId })
    .whereIn('id', partIds)
    .count<{ count: string }[]>('* as count')
    .first();
  return Number(row?.count ?? 0);
}

export async function setStepParts(trx: Knex.Transaction, stepId: string, partIds: string[]) {
  await trx('install_step_parts').where({ step_id: stepId }).delete();
  if (partIds.length) {
    await trx('install_step_parts').insert(
      [...new Set(partIds)].map((part_id) => ({ step_id: stepId, part_id })),
    );
  }
}

/** Steps a shop member may read: those linked to a part sent to that shop. */
export async function stepIdsForShop(
  knex: Knex,
  buildId: string,
  shopUserId: string,
): Promise<Set<string>> {
  const rows: { step_id: string }[] = await knex('install_step_parts as sp')
    .join('install_steps as s', 's.id', 'sp.step_id')
    .join('parts as p', 'p.id', 'sp.part_id')
    .where({ 's.build_id': buildId, 'p.shop_user_id': shopUserId })
    .distinct('sp.step_id');
  return new Set(rows.map((r) => r.step_id));
}

// ---- checklist ------------------------------------------------------------------

type ItemRow = {
  id: string;
  step_id: string;
  position: number;
  label: string;
  done_by: string | null;
  done_by_name: string | null;
  done_at: Date | null;
};

function toItem(r: ItemRow) {
  return {
    id: r.id,
    stepId: r.step_id,
    position: r.position,
    label: r.label,
    done: r.done_at != null,
    doneBy: r.done_at ? person(r.done_by, r.done_by_name) : null,
    doneAt: iso(r.done_at),
  };
}

function items(knex: Knex) {
  return knex('install_checklist_items as c')
    .leftJoin('users as u', 'u.id', 'c.done_by')
    .select('c.*', 'u.display_name as done_by_name');
}

export async function listChecklist(knex: Knex, stepIds: string[]) {
  if (!stepIds.length) return [];
  const rows: ItemRow[] = await items(knex)
    .whereIn('c.step_id', stepIds)
    .orderBy([{ column: 'c.position' }, { column: 'c.created_at' }]);
  return rows.map(toItem);
}

export async function findChecklistItem(knex: Knex, buildId: string, itemId: string) {
  const row: ItemRow | undefined = await items(knex)
    .join('install_steps as s', 's.id', 'c.step_id')
    .where({ 'c.id': itemId, 's.build_id': buildId })
    .first();
  return row ? toItem(row) : undefined;
}

export async function insertChecklistItem(
  trx: Knex.Transaction,
  stepId: string,
  label: string,
  position: number,
) {
  const [row] = await trx('install_checklist_items')
    .insert({ step_id: stepId, label, position })
    .returning('id');
  return row.id as string;
}

export async function updateChecklistItem(
  knex: Knex,
  itemId: string,
  input: { label?: string; done?: boolean; userId: string },
) {
  const row: Record<string, unknown> = { updated_at: knex.fn.now() };
  if (input.label !== undefined) row.label = input.label;
  if (input.done === true) {
    // Ticking an already-ticked item keeps who ticked it first.
    row.done_by = knex.raw('case when done_at is null then ? else done_by end', [input.userId]);
    row.done_at = knex.raw('coalesce(done_at, now())');
  } else if (input.done === false) {
    row.done_by = null;
    row.done_at = null;
  }
  await knex('install_checklist_items').where({ id: itemId }).update(row);
}

export async function deleteChecklistItem(knex: Knex, itemId: string) {
  await knex('install_checklist_items').where({ id: itemId }).delete();
}

// ---- fastener specs ---------------------------------------------------------------

type SpecRow = {
  id: string;
  step_id: string;
  position: number;
  name: string;
  count: number;
  target_value: number;
  target_unit: TorqueUnit;
  tolerance_type: 'value' | 'percent';
  tolerance_value: number;
  stages: number[];
  final_angle_deg: number | null;
  thread_condition: ThreadCondition;
  sequence_note: string;
  spec_source: string;
  retorque_after_heat_cycles: number | null;
  retorque_after_miles: number | null;
  retorque_closed_by: string | null;
  retorque_closed_by_name: string | null;
  retorque_closed_at: Date | null;
  retorque_close_note: string;
  created_at: Date;
  updated_at: Date;
};

const specColumns = {
  name: 'name',
  count: 'count',
  targetValue: 'target_value',
  targetUnit: 'target_unit',
  toleranceType: 'tolerance_type',
  toleranceValue: 'tolerance_value',
  stages: 'stages',
  finalAngleDeg: 'final_angle_deg',
  threadCondition: 'thread_condition',
  sequenceNote: 'sequence_note',
  specSource: 'spec_source',
  retorqueAfterHeatCycles: 'retorque_after_heat_cycles',
  retorqueAfterMiles: 'retorque_after_miles',
} as const;
export type SpecFieldsInput = Partial<{
  [K in keyof typeof specColumns]: unknown;
}>;

function toSpec(r: SpecRow) {
  return {
    id: r.id,
    stepId: r.step_id,
    position: r.position,
    name: r.name,
    count: r.count,
    targetValue: r.target_value,
    targetUnit: r.target_unit,
    toleranceType: r.tolerance_type,
    toleranceValue: r.tolerance_value,
    stages: r.stages,
    finalAngleDeg: r.final_angle_deg,
    threadCondition: r.thread_condition,
    sequenceNote: r.sequence_note,
    specSource: r.spec_source,
    retorqueAfterHeatCycles: r.retorque_after_heat_cycles,
    retorqueAfterMiles: r.retorque_after_miles,
    retorqueClosedBy: person(r.retorque_closed_by, r.retorque_closed_by_name),
    retorqueClosedAt: iso(r.retorque_closed_at),
    retorqueCloseNote: r.retorque_close_note,
    createdAt: r.created_at.toISOString(),
    updatedAt: r.updated_at.toISOString(),
  };
}
export type SpecRecord = ReturnType<typeof toSpec>;

function specRow(input: SpecFieldsInput) {
  const row: Record<string, unknown> = {};
  for (const [key, column] of Object.entries(specColumns)) {
    const value = input[key as keyof typeof specColumns];
    if (value === undefined) continue;
    row[column] = key === 'stages' ? JSON.stringify(value ?? []) : value;
  }
  return row;
}

function specs(knex: Knex) {
  return knex('fastener_specs as f')
    .leftJoin('users as u', 'u.id', 'f.retorque_closed_by')
    .select('f.*', 'u.display_name as retorque_closed_by_name');
}

export async function listSpecs(knex: Knex, stepIds: string[]) {
  if (!stepIds.length) return [];
  const rows: SpecRow[] = await specs(knex)
    .whereIn('f.step_id', stepIds)
    .orderBy([{ column: 'f.position' }, { column: 'f.created_at' }]);
  return rows.map(toSpec);
}

export async function findSpec(knex: Knex, buildId: string, specId: string) {
  const row: SpecRow | undefined = await specs(knex)
    .join('install_steps as s', 's.id', 'f.step_id')
    .where({ 'f.id': specId, 's.build_id': buildId })
    .first();
  return row ? toSpec(row) : undefined;
}

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

export async function insertSpec(
  trx: Knex.Transaction,
  stepId: string,
  input: SpecFieldsInput,
  position: number,
) {
  const [row] = await trx('fastener_specs')
    .insert({ ...specRow(input), step_id: stepId, position })
    .returning('id');
  return row.id as string;
}

export async function updateSpec(knex: Knex, specId: string, input: SpecFieldsInput) {
  await knex('fastener_specs')
    .where({ id: specId })
    .update({ ...specRow(input), updated_at: knex.fn.now() });
}

export async function closeRetorque(knex: Knex, specId: string, userId: string, note: string) {
  await knex('fastener_specs').where({ id: specId }).update({
    retorque_closed_by: userId,
    retorque_closed_at: knex.fn.now(),
    retorque_close_note: note,
    updated_at: knex.fn.now(),
  });
}

export async function deleteSpec(knex: Knex, specId: string) {
  await knex('fastener_specs').where({ id: specId }).delete();
}

/** Locks the spec row: readings for one spec are recorded one at a time. */
export async function lockSpec(trx: Knex.Transaction, specId: string) {
  await trx('fastener_specs').where({ id: specId }).forUpdate().first('id');
}

// ---- readings ---------------------------------------------------------------------

type ReadingRow = {
  id: string;
  spec_id: string;
  position: number;
  kind: 'install' | 'retorque';
  value: number;
  unit: TorqueUnit;
  wrench: string;
  note: string;
  recorded_by: string | null;
  recorded_by_name: string | null;
  recorded_at: Date;
  superseded_by_id: string | null;
  superseded_at: Date | null;
};

function toReading(r: ReadingRow) {
  return {
    id: r.id,
    specId: r.spec_id,
    position: r.position,
    kind: r.kind,
    value: r.value,
    unit: r.unit,
    wrench: r.wrench,
    note: r.note,
    recordedBy: person(r.recorded_by, r.recorded_by_name),
    recordedAt: r.recorded_at.toISOString(),
    supersededById: r.superseded_by_id,
    supersededAt: iso(r.superseded_at),
  };
}
export type ReadingRecord = ReturnType<typeof toReading>;

/** Readings of these specs, newest first (superseded ones included). */
export async function listReadings(knex: Knex, specIds: string[]) {
  if (!specIds.length) return [];
  const rows: ReadingRow[] = await knex('torque_readings as r')
    .leftJoin('users as u', 'u.id', 'r.recorded_by')
    .whereIn('r.spec_id', specIds)
    .orderBy([
      { column: 'r.position' },
      { column: 'r.recorded_at', order: 'desc' },
      { column: 'r.superseded_at', order: 'desc', nulls: 'first' },
    ])
    .select('r.*', 'u.display_name as recorded_by_name');
  return rows.map(toReading);
}

export async function findReading(knex: Knex, readingId: string) {
  const row: ReadingRow | undefined = await knex('torque_readings as r')
    .leftJoin('users as u', 'u.id', 'r.recorded_by')
    .where('r.id', readingId)
    .first('r.*', 'u.display_name as recorded_by_name');
  return row ? toReading(row) : undefined;
}

/**
 * Records a reading. The current reading of the same spec, kind and position,
 * if any, is kept and marked superseded by the new one. Run inside a
 * transaction that holds lockSpec(), so two readings cannot both become current.
 */
export async function insertReading(
  trx: Knex.Transaction,
  input: {
    specId: string;
    position: number;
    kind: 'install' | 'retorque';
    value: number;
    unit: TorqueUnit;
    wrench: string;
    note: string;
    userId: string;
  },
) {
  // Mark the old one first: the unique index allows one current reading at a time.
  const previous: { id: string }[] = await trx('torque_readings')
    .where({ spec_id: input.specId, kind: input.kind, position: input.position })
    .whereNull('superseded_at')
    .update({ superseded_at: trx.fn.now() })
    .returning('id');
  const [row] = await trx('torque_readings')
    .insert({
      spec_id: input.specId,
      position: input.position,
      kind: input.kind,
      value: input.value,
      unit: input.unit,
      wrench: input.wrench,
      note: input.note,
      recorded_by: input.userId,
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

/** Whether a spec has any readings (its torque fields are then the owner's to change). */
/** The highest fastener position that holds a reading (0 when none). */
export async function highestReadPosition(knex: Knex, specId: string): Promise<number> {
  const row = await knex('torque_readings')
    .where({ spec_id: specId })
    .max('position as max')
    .first();
  return Number(row?.max ?? 0);
}

export async function specHasReadings(knex: Knex, specId: string) {
  const row = await knex('torque_readings').where({ spec_id: specId }).first('id');
  return Boolean(row);
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
