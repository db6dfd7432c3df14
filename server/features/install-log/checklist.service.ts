/** A step's checklist: items to tick before sign-off, in order. */
import type {
  CreateChecklistItemInput,
  UpdateChecklistItemInput,
} from '@shared/schemas/install-log';
import { NotFoundError } from '@server/lib/errors';
import { parseId, type BuildScope } from '@server/lib/scope';
import { loadStep, lockOpenStep, renameNotFound } from './access';
import * as repo from './checklist.repository';
import { lockOrdering } from './ordering.repository';
import * as stepsRepo from './steps.repository';

export async function addChecklistItem(
  scope: BuildScope,
  rawStepId: string,
  input: CreateChecklistItemInput,
) {
  const { knex, buildId } = scope;
  const step = await loadStep(scope, rawStepId);
  const id = await knex.transaction(async (trx) => {
    const order = await lockOrdering(trx, buildId);
    await lockOpenStep(trx, step.id);
    const position = await order.nextPosition('install_checklist_items', step.id);
    return repo.insertChecklistItem(trx, step.id, input.label, position);
  });
  return (await repo.findChecklistItem(knex, buildId, id))!;
}

/** An item of a step the caller may see, or 404. */
async function loadItem(scope: BuildScope, rawItemId: string) {
  const id = parseId(rawItemId, 'Checklist item');
  const item = await repo.findChecklistItem(scope.knex, scope.buildId, id);
  if (!item) throw new NotFoundError('Checklist item not found');
  const step = await loadStep(scope, item.stepId).catch(renameNotFound('Checklist item not found'));
  return { item, step };
}

/** Ticking records who and when; the step is then under way. */
export async function updateChecklistItem(
  scope: BuildScope,
  rawItemId: string,
  input: UpdateChecklistItemInput,
) {
  const { knex, buildId, caller } = scope;
  const { item, step } = await loadItem(scope, rawItemId);
  await knex.transaction(async (trx) => {
    await lockOpenStep(trx, step.id);
    await repo.updateChecklistItem(trx, item.id, { ...input, userId: caller.userId });
    if (input.done) await stepsRepo.markUnderWay(trx, step.id);
  });
  return (await repo.findChecklistItem(knex, buildId, item.id))!;
}

export async function deleteChecklistItem(scope: BuildScope, rawItemId: string) {
  const { item, step } = await loadItem(scope, rawItemId);
  await scope.knex.transaction(async (trx) => {
    const order = await lockOrdering(trx, scope.buildId);
    await lockOpenStep(trx, step.id);
    await repo.deleteChecklistItem(trx, item.id);
    await order.closeGaps('install_checklist_items', step.id);
  });
}
