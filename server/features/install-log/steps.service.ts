/** Steps of a job: adding, changing, moving and deleting them, and signing them off. */
import type { ChoosableCautionId } from '@shared/install-log/cautions';
import type { SignOffBlocker } from '@shared/install-log/sign-off';
import { can } from '@shared/permissions';
import type { CreateStepInput, SignOffInput, UpdateStepInput } from '@shared/schemas/install-log';
import { ConflictError, ForbiddenError, ValidationError } from '@server/lib/errors';
import type { BuildScope } from '@server/lib/scope';
import * as files from '@server/features/files';
import { assertOpen, loadJob, loadStep, lockStep } from './access';
import { notifyStepSignedOff } from './install-log.notices';
import * as jobsRepo from './jobs.repository';
import { lockOrdering } from './ordering.repository';
import * as stepPartsRepo from './step-parts.repository';
import { assembleSteps, stepDetail } from './steps.detail';
import * as repo from './steps.repository';

async function checkParts({ knex, buildId }: BuildScope, partIds: string[] | undefined) {
  if (!partIds?.length) return;
  const unique = [...new Set(partIds)];
  if ((await stepPartsRepo.countBuildParts(knex, buildId, unique)) !== unique.length) {
    throw new ValidationError('A linked part is not a part of this build', {
      partIds: 'Choose parts from this build',
    });
  }
}

/**
 * The ticked cautions and the off-the-ground mark say the same about lifting: `cautions`
 * wins and sets the mark; a mark alone (older callers) adds or removes lifting from the
 * ticks, if the author has ticked any.
 */
function cautionFields(
  input: { cautions?: ChoosableCautionId[]; liftsVehicle?: boolean },
  chosen: ChoosableCautionId[] | null,
) {
  if (input.cautions) {
    return { cautions: input.cautions, liftsVehicle: input.cautions.includes('lifting') };
  }
  if (input.liftsVehicle === undefined || chosen === null) return {};
  const others = chosen.filter((id) => id !== 'lifting');
  return {
    cautions: input.liftsVehicle ? [...others, 'lifting' as const] : others,
    liftsVehicle: input.liftsVehicle,
  };
}

export async function createStep(scope: BuildScope, rawJobId: string, input: CreateStepInput) {
  const { knex, buildId } = scope;
  const job = await loadJob(scope, rawJobId);
  await checkParts(scope, input.partIds);
  const id = await knex.transaction(async (trx) => {
    const order = await lockOrdering(trx, buildId);
    // Deleted while this request waited for the lock: 404, not a foreign-key error.
    await loadJob({ ...scope, knex: trx }, job.id);
    const last = await order.nextPosition('install_steps', job.id);
    const stepId = await repo.insertStep(trx, buildId, job.id, {
      ...input,
      ...cautionFields(input, null),
      position: last,
    });
    if (input.position !== undefined && input.position < last) {
      await order.moveTo('install_steps', job.id, stepId, input.position);
    }
    if (input.partIds) await stepPartsRepo.setStepParts(trx, stepId, input.partIds);
    return stepId;
  });
  return getStep(scope, id);
}

export async function getStep(scope: BuildScope, rawStepId: string) {
  const step = await loadStep(scope, rawStepId);
  return stepDetail(scope, step.id);
}

export async function updateStep(scope: BuildScope, rawStepId: string, input: UpdateStepInput) {
  const step = await loadStep(scope, rawStepId);
  if (input.status !== undefined) assertOpen(step);
  await checkParts(scope, input.partIds);
  await scope.knex.transaction(async (trx) => {
    const order = await lockOrdering(trx, scope.buildId);
    const status = await lockStep(trx, step.id);
    if (input.status !== undefined) assertOpen({ status });
    await repo.updateStep(trx, step.id, { ...input, ...cautionFields(input, step.cautionChoice) });
    if (input.partIds) await stepPartsRepo.setStepParts(trx, step.id, input.partIds);
    if (input.position !== undefined) {
      await order.moveTo('install_steps', step.jobId, step.id, input.position);
    }
  });
  return stepDetail(scope, step.id);
}

/** The step and its photos by cascade; the photos' files are queued in the same transaction. */
export async function deleteStep(
  scope: BuildScope,
  store: Omit<files.FilesCtx, 'knex'>,
  rawStepId: string,
) {
  const { knex } = scope;
  const step = await loadStep(scope, rawStepId);
  await knex.transaction(async (trx) => {
    const order = await lockOrdering(trx, scope.buildId);
    await repo.deleteStep(trx, step.id);
    await order.closeGaps('install_steps', step.jobId);
  });
  await files.purgeSoon({ knex, ...store });
}

// ---- sign-off -------------------------------------------------------------------------------------

function blockerField(b: SignOffBlocker): string {
  if (b.kind === 'out-of-spec') return `fasteners.${b.specId}.${b.position}`;
  if (b.kind === 'missing-readings') return `fasteners.${b.specId}`;
  return `checklist.${b.itemId}`;
}

/**
 * Sign-off rule: refused (409 sign_off_blocked, one field per blocker) while any
 * current fitting reading is out of spec, any position has no reading, or any
 * check is unticked — unless the owner gives overrideReason, which is stored with
 * the blockers it overrode. Anyone but the owner sending overrideReason gets 403.
 */
export async function signOff(scope: BuildScope, rawStepId: string, input: SignOffInput) {
  const { knex, buildId, caller } = scope;
  const step = await loadStep(scope, rawStepId);
  if (input.overrideReason !== undefined && !can(caller.role, 'install:override')) {
    throw new ForbiddenError('Only the owner can sign off over out-of-spec or missing readings');
  }
  await knex.transaction(async (trx) => {
    const status = await lockStep(trx, step.id);
    if (status === 'signed-off')
      throw new ConflictError('already_signed_off', 'This step is already signed off');
    const inTrx = { ...scope, knex: trx };
    const [current] = await assembleSteps(inTrx, [(await repo.findStep(trx, buildId, step.id))!]);
    const blockers = current.signOffBlockers;
    if (blockers.length && input.overrideReason === undefined) {
      const fields: Record<string, string> = {};
      for (const b of blockers) fields[blockerField(b)] ??= b.message;
      throw new ConflictError(
        'sign_off_blocked',
        `This step cannot be signed off yet: ${blockers.map((b) => b.message).join('; ')}`,
        fields,
      );
    }
    const override = blockers.length > 0;
    await repo.signOffStep(trx, step.id, {
      userId: caller.userId,
      overrideReason: override ? input.overrideReason! : null,
      overrideBlockers: override ? blockers : null,
    });
    await notifyStepSignedOff(trx, {
      buildId,
      stepId: step.id,
      stepTitle: step.title,
      jobTitle: (await jobsRepo.findJob(trx, buildId, step.jobId))?.title ?? '',
      overrideReason: override ? input.overrideReason! : null,
      actorUserId: caller.userId,
    });
  });
  return stepDetail(scope, step.id);
}

/** Owner only: takes a step back to "under way" so it can be changed; the old sign-off is cleared. */
export async function reopen(scope: BuildScope, rawStepId: string) {
  const step = await loadStep(scope, rawStepId);
  await scope.knex.transaction(async (trx) => {
    const status = await lockStep(trx, step.id);
    if (status !== 'signed-off')
      throw new ConflictError('not_signed_off', 'This step is not signed off');
    await repo.reopenStep(trx, step.id);
  });
  return stepDetail(scope, step.id);
}
