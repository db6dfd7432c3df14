/** Fastener specs of a step: what to torque, to what, and whether to re-check it later. */
import type { Knex } from 'knex';
import type { TorqueUnit } from '@shared/install-log/torque';
import type { ThreadCondition } from '@shared/schemas/install-log';
import { namedRows } from '@server/lib/named-query';
import { iso, person } from './rows';

export type SpecRow = {
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
  position_names: string[];
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
  positionNames: 'position_names',
  specSource: 'spec_source',
  retorqueAfterHeatCycles: 'retorque_after_heat_cycles',
  retorqueAfterMiles: 'retorque_after_miles',
} as const;
export type SpecFieldsInput = Partial<{
  [K in keyof typeof specColumns]: unknown;
}>;

export function toSpec(r: SpecRow) {
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
    positionNames: r.position_names,
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
    row[column] = key === 'stages' || key === 'positionNames' ? JSON.stringify(value ?? []) : value;
  }
  return row;
}

/** Specs with the name of who closed their re-torque check; `f` is fastener_specs. */
export function specs(knex: Knex) {
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

/** What judging a reading needs of its spec, and what a step's progress counts. */
export type SpecTarget = {
  id: string;
  stepId: string;
  count: number;
  targetValue: number;
  targetUnit: TorqueUnit;
  toleranceType: 'value' | 'percent';
  toleranceValue: number;
};

export type SpecWithCurrent = {
  spec: SpecTarget;
  current: { position: number; value: number; unit: TorqueUnit }[];
};

/**
 * Every fastener spec of the build's steps with the current final fitting reading
 * of each position (value and unit only; stage readings left out), in one named
 * statement with its columns written out: what progress counts need. A row a
 * reading, or one with null reading columns for a spec without any.
 */
const specsWithReadingsSql = `select f.id, f.step_id, f.count, f.target_value, f.target_unit,
    f.tolerance_type, f.tolerance_value,
    r.position as reading_position, r.value as reading_value, r.unit as reading_unit
  from fastener_specs f
  join install_steps s on s.id = f.step_id
  left join torque_readings r on r.spec_id = f.id and r.kind = 'install'
    and r.stage is null and r.superseded_at is null
  where s.build_id = ?`;

export async function listSpecsWithCurrentReadings(knex: Knex, buildId: string) {
  const rows = await namedRows<
    Pick<
      SpecRow,
      | 'id'
      | 'step_id'
      | 'count'
      | 'target_value'
      | 'target_unit'
      | 'tolerance_type'
      | 'tolerance_value'
    > & {
      reading_position: number | null;
      reading_value: number | null;
      reading_unit: TorqueUnit | null;
    }
  >(knex, 'specs-with-current-readings', specsWithReadingsSql, [buildId]);
  const byId = new Map<string, SpecWithCurrent>();
  for (const row of rows) {
    let entry = byId.get(row.id);
    if (!entry) {
      entry = {
        spec: {
          id: row.id,
          stepId: row.step_id,
          count: row.count,
          targetValue: row.target_value,
          targetUnit: row.target_unit,
          toleranceType: row.tolerance_type,
          toleranceValue: row.tolerance_value,
        },
        current: [],
      };
      byId.set(row.id, entry);
    }
    if (row.reading_position != null && row.reading_value != null && row.reading_unit) {
      entry.current.push({
        position: row.reading_position,
        value: row.reading_value,
        unit: row.reading_unit,
      });
    }
  }
  return [...byId.values()];
}

export async function findSpec(knex: Knex, buildId: string, specId: string) {
  const row: SpecRow | undefined = await specs(knex)
    .join('install_steps as s', 's.id', 'f.step_id')
    .where({ 'f.id': specId, 's.build_id': buildId })
    .first();
  return row ? toSpec(row) : undefined;
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

export async function deleteSpec(knex: Knex, specId: string) {
  await knex('fastener_specs').where({ id: specId }).delete();
}
