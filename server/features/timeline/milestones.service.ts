/** Milestones: dated goals the owner sets on the way to the target date. */
import type { CreateMilestoneInput, UpdateMilestoneInput } from '@shared/schemas/timeline';
import { NotFoundError } from '@server/lib/errors';
import { parseId, type BuildScope } from '@server/lib/scope';
import * as repo from './milestones.repository';

export const list = ({ knex, buildId }: BuildScope) => repo.listMilestones(knex, buildId);

export const create = ({ knex, buildId, caller }: BuildScope, input: CreateMilestoneInput) =>
  repo.insertMilestone(knex, buildId, input, caller.userId);

export async function update(
  { knex, buildId }: BuildScope,
  rawId: string,
  input: UpdateMilestoneInput,
) {
  const milestone = await repo.updateMilestone(knex, buildId, parseId(rawId, 'Milestone'), input);
  if (!milestone) throw new NotFoundError('Milestone not found');
  return milestone;
}

export async function remove({ knex, buildId }: BuildScope, rawId: string) {
  if (!(await repo.deleteMilestone(knex, buildId, parseId(rawId, 'Milestone')))) {
    throw new NotFoundError('Milestone not found');
  }
}
