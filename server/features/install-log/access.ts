/**
 * What a caller may reach in the install log, shared by its services: every
 * member sees every job and step, except a shop, which sees only the steps
 * linked to parts sent to it (and the jobs holding them). Something hidden
 * answers 404, exactly like something that does not exist.
 */
import type { Knex } from 'knex';
import { ConflictError, NotFoundError } from '@server/lib/errors';
import { parseId, type BuildScope } from '@server/lib/scope';
import * as jobsRepo from './jobs.repository';
import * as stepPartsRepo from './step-parts.repository';
import * as stepsRepo from './steps.repository';

/** Steps a caller may read: all of them (null), or for a shop only those linked to its parts. */
export async function visibleSteps({
  knex,
  buildId,
  caller,
}: BuildScope): Promise<Set<string> | null> {
  return caller.role === 'shop' ? stepPartsRepo.stepIdsForShop(knex, buildId, caller.userId) : null;
}

/** A step the caller may see (a shop: only steps linked to its parts), or 404. */
export async function loadStep(scope: BuildScope, rawStepId: string) {
  const step = await stepsRepo.findStep(scope.knex, scope.buildId, parseId(rawStepId, 'Step'));
  if (!step) throw new NotFoundError('Step not found');
  const visible = await visibleSteps(scope);
  // Another step is as invisible to a shop as a step that does not exist.
  if (visible && !visible.has(step.id)) throw new NotFoundError('Step not found');
  return step;
}

/** A job of the build, or 404. Whether a shop may see it depends on its steps: see getJob. */
export async function loadJob({ knex, buildId }: BuildScope, rawJobId: string) {
  const job = await jobsRepo.findJob(knex, buildId, parseId(rawJobId, 'Job'));
  if (!job) throw new NotFoundError('Job not found');
  return job;
}

/** A hidden step makes what hangs off it not found too, under its own name. */
export function renameNotFound(message: string) {
  return (err: unknown): never => {
    throw err instanceof NotFoundError ? new NotFoundError(message) : err;
  };
}

export function assertOpen(step: { status: string }) {
  if (step.status === 'signed-off') {
    throw new ConflictError(
      'step_signed_off',
      'This step is signed off. The owner can reopen it to change it.',
    );
  }
}

/**
 * Locks the step's row for the rest of the transaction and answers its status;
 * 404 if it was deleted since it was loaded (writing under it would fail its foreign key).
 */
export async function lockStep(trx: Knex.Transaction, stepId: string) {
  const status = await stepsRepo.lockStep(trx, stepId);
  if (!status) throw new NotFoundError('Step not found');
  return status;
}

/** lockStep, and 409 if the step is signed off. */
export async function lockOpenStep(trx: Knex.Transaction, stepId: string) {
  assertOpen({ status: await lockStep(trx, stepId) });
}
