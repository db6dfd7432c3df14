/** The only place milestones are queried. */
import type { Knex } from 'knex';
import type {
  CreateMilestoneInput,
  Milestone,
  UpdateMilestoneInput,
} from '@shared/schemas/timeline';

type Row = {
  id: string;
  build_id: string;
  title: string;
  due_on: string;
  done: boolean;
  created_at: Date;
  updated_at: Date;
};

function toMilestone(r: Row): Milestone {
  return {
    id: r.id,
    buildId: r.build_id,
    title: r.title,
    dueOn: r.due_on,
    done: r.done,
    createdAt: r.created_at.toISOString(),
    updatedAt: r.updated_at.toISOString(),
  };
}

function toRow(input: UpdateMilestoneInput) {
  const row: Record<string, unknown> = {};
  if (input.title !== undefined) row.title = input.title;
  if (input.dueOn !== undefined) row.due_on = input.dueOn;
  if (input.done !== undefined) row.done = input.done;
  return row;
}

export async function listMilestones(knex: Knex, buildId: string): Promise<Milestone[]> {
  const rows: Row[] = await knex('milestones')
    .where({ build_id: buildId })
    .orderBy([{ column: 'due_on' }, { column: 'created_at' }, { column: 'id' }]);
  return rows.map(toMilestone);
}

export async function findMilestone(knex: Knex, buildId: string, id: string) {
  const row: Row | undefined = await knex('milestones').where({ build_id: buildId, id }).first();
  return row ? toMilestone(row) : undefined;
}

export async function insertMilestone(
  knex: Knex,
  buildId: string,
  input: CreateMilestoneInput,
  createdBy: string,
): Promise<Milestone> {
  const [row] = await knex('milestones')
    .insert({ build_id: buildId, created_by: createdBy, ...toRow(input) })
    .returning('*');
  return toMilestone(row);
}

/** The milestone as changed, or undefined when it is gone. */
export async function updateMilestone(
  knex: Knex,
  buildId: string,
  id: string,
  input: UpdateMilestoneInput,
): Promise<Milestone | undefined> {
  const [row] = await knex('milestones')
    .where({ build_id: buildId, id })
    .update({ ...toRow(input), updated_at: knex.fn.now() })
    .returning('*');
  return row ? toMilestone(row) : undefined;
}

export async function deleteMilestone(knex: Knex, buildId: string, id: string): Promise<number> {
  return knex('milestones').where({ build_id: buildId, id }).delete();
}
