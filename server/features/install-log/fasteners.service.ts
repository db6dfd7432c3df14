/**
 * Fastener specs of a step and their torque readings: how readings supersede
 * each other, and who may change a target that readings were judged against.
 */
import { positionLabel } from '@shared/install-log/positions';
import { asksRetorque, readingKindRefusal } from '@shared/install-log/retorque';
import { judgeTorque } from '@shared/install-log/torque';
import { can } from '@shared/permissions';
import {
  fastenerSpecIssues,
  torqueDefiningFields,
  type CreateFastenerSpecInput,
  type CreateReadingInput,
  type UpdateFastenerSpecInput,
} from '@shared/schemas/install-log';
import { ConflictError, ForbiddenError, NotFoundError, ValidationError } from '@server/lib/errors';
import { parseId, type BuildScope } from '@server/lib/scope';
import * as builds from '@server/features/builds';
import { wrenchForReading } from '@server/features/wrenches';
import { assertOpen, loadStep, lockOpenStep, lockStep, renameNotFound } from './access';
import { presentReading, presentSpec } from './fasteners.present';
import * as repo from './fasteners.repository';
import { notifyTorqueOutOfSpec } from './install-log.notices';
import { lockOrdering } from './ordering.repository';
import { checkTakenAt, checkTargetUnchanged } from './late-readings';
import * as readingsRepo from './readings.repository';
import * as stepsRepo from './steps.repository';

/** A spec on a step the caller may see, with that step, or 404. */
export async function loadSpec(scope: BuildScope, rawSpecId: string) {
  const spec = await repo.findSpec(scope.knex, scope.buildId, parseId(rawSpecId, 'Fastener'));
  if (!spec) throw new NotFoundError('Fastener not found');
  const step = await loadStep(scope, spec.stepId).catch(renameNotFound('Fastener not found'));
  return { spec, step };
}

function checkSpec(merged: Record<string, unknown>) {
  const issues = fastenerSpecIssues(merged);
  if (Object.keys(issues).length)
    throw new ValidationError('Some fields contradict each other', issues);
}

async function presentOne({ knex, buildId }: BuildScope, specId: string) {
  const spec = (await repo.findSpec(knex, buildId, specId))!;
  return presentSpec(spec, await readingsRepo.listReadings(knex, [spec.id]));
}

export async function addFastener(
  scope: BuildScope,
  rawStepId: string,
  input: CreateFastenerSpecInput,
) {
  const step = await loadStep(scope, rawStepId);
  checkSpec(input);
  const { position, ...fields } = input;
  const id = await scope.knex.transaction(async (trx) => {
    const order = await lockOrdering(trx, scope.buildId);
    await lockOpenStep(trx, step.id);
    const last = await order.nextPosition('fastener_specs', step.id);
    const specId = await repo.insertSpec(trx, step.id, fields, last);
    if (position !== undefined && position < last) {
      await order.moveTo('fastener_specs', step.id, specId, position);
    }
    return specId;
  });
  return presentOne(scope, id);
}

export async function updateFastener(
  scope: BuildScope,
  rawSpecId: string,
  input: UpdateFastenerSpecInput,
) {
  const { spec, step } = await loadSpec(scope, rawSpecId);
  checkSpec({ ...spec, ...input });
  await scope.knex.transaction(async (trx) => {
    await lockOpenStep(trx, step.id);
    const changesTorque = torqueDefiningFields.some(
      (k) => input[k] !== undefined && input[k] !== spec[k],
    );
    // Changing the target under recorded readings changes their verdicts: the owner's call only.
    if (
      changesTorque &&
      !can(scope.caller.role, 'install:override') &&
      (await readingsRepo.specHasReadings(trx, spec.id))
    ) {
      throw new ForbiddenError(
        'This fastener already has readings; only the owner can change its target or tolerance',
      );
    }
    // Fewer fasteners than positions already torqued would hide those readings.
    if (input.count !== undefined && input.count < spec.count) {
      const highest = await readingsRepo.highestReadPosition(trx, spec.id);
      if (input.count < highest) {
        throw new ValidationError('Readings exist for higher positions', {
          count: `Position ${highest} already has a reading; keep at least ${highest}`,
        });
      }
    }
    // Likewise fewer stages than stages already read.
    if (input.stages !== undefined && input.stages.length < spec.stages.length) {
      const highest = await readingsRepo.highestReadStage(trx, spec.id);
      if (input.stages.length < highest) {
        throw new ValidationError('Readings exist for a later stage', {
          stages: `Stage ${highest} already has readings; keep at least ${highest} stages`,
        });
      }
    }
    await repo.updateSpec(trx, spec.id, input);
  });
  return presentOne(scope, spec.id);
}

export async function deleteFastener(scope: BuildScope, rawSpecId: string) {
  const { spec, step } = await loadSpec(scope, rawSpecId);
  await scope.knex.transaction(async (trx) => {
    const order = await lockOrdering(trx, scope.buildId);
    await lockOpenStep(trx, step.id);
    await repo.deleteSpec(trx, spec.id);
    await order.closeGaps('fastener_specs', step.id);
  });
}

// ---- readings -------------------------------------------------------------------------------

/** Every reading of a fastener, newest first per position, superseded ones included. */
export async function listReadings(scope: BuildScope, rawSpecId: string) {
  const { spec } = await loadSpec(scope, rawSpecId);
  const readings = await readingsRepo.listReadings(scope.knex, [spec.id]);
  return {
    fastener: presentSpec(spec, readings),
    readings: readings.map((r) => presentReading(r, spec)),
  };
}

/** Refuses a stage the spec does not have, and a stage on a re-check. */
function checkStage(spec: { name: string; stages: number[] }, input: CreateReadingInput) {
  if (input.stage === undefined) return;
  if (input.retorque) {
    throw new ValidationError('A re-check is of the final torque', {
      stage: 'Record a re-check without a stage',
    });
  }
  if (input.stage > spec.stages.length) {
    const n = spec.stages.length;
    throw new ValidationError(
      `${spec.name} has ${n ? `${n} stage${n === 1 ? '' : 's'}` : 'no stages'}`,
      {
        stage: n ? `Choose a stage from 1 to ${n}, or the final torque` : 'Record the final torque',
      },
    );
  }
}

/** What the reading keeps of the wrench: a registered one's name and calibration, or typed words. */
async function wrenchOf(scope: BuildScope, input: CreateReadingInput) {
  if (!input.wrenchId) {
    return { wrench: input.wrench ?? '', wrenchId: null, calibratedOn: null, dueOn: null };
  }
  const w = await wrenchForReading(scope.knex, {
    buildId: scope.buildId,
    userId: scope.caller.userId,
    wrenchId: input.wrenchId,
    on: (await builds.calendar(scope.knex, scope.buildId)).today,
  });
  return { wrench: w.name, wrenchId: w.id, calibratedOn: w.calibratedOn, dueOn: w.dueOn };
}

/**
 * Records a reading. Supersede rule: the new reading replaces the current one
 * of the same fastener, position, kind (fitting or re-torque) and stage; the old
 * one is kept, marked superseded by the new one. Fitting readings are refused on a
 * signed-off step; re-torque readings need a signed-off step and a spec that
 * asks for a re-check. A reading taken with one of the person's wrenches keeps
 * its calibration; one past the build's calibration interval is recorded with a
 * warning, never refused.
 */
export async function recordReading(
  scope: BuildScope,
  rawSpecId: string,
  input: CreateReadingInput,
) {
  const { knex, buildId, caller } = scope;
  const { spec, step } = await loadSpec(scope, rawSpecId);
  if (input.position > spec.count) {
    throw new ValidationError(
      `${spec.name} has ${spec.count} position${spec.count === 1 ? '' : 's'}`,
      {
        position: `Choose a position from 1 to ${spec.count}`,
      },
    );
  }
  checkStage(spec, input);
  const takenAt = checkTakenAt(input.takenAt);
  const kind = input.retorque ? 'retorque' : 'install';
  if (kind === 'retorque' && !asksRetorque(spec)) {
    throw new ValidationError('This fastener asks for no re-torque check', {
      retorque: 'Record it as a fitting reading',
    });
  }
  const wrench = await wrenchOf(scope, input);
  const stage = input.stage ?? null;
  const { id, supersededId } = await knex.transaction(async (trx) => {
    const status = await lockStep(trx, step.id);
    const refusal = readingKindRefusal(kind, {
      signedOff: status === 'signed-off',
      retorqueAsked: asksRetorque(spec),
    });
    if (refusal === 'step-signed-off') assertOpen({ status });
    else if (refusal === 'step-not-signed-off') {
      throw new ConflictError(
        'step_not_signed_off',
        'Re-torque checks come after the step is signed off',
      );
    }
    if (input.expectedTarget) {
      await checkTargetUnchanged(trx, buildId, spec.id, input.expectedTarget);
    }
    const result = await readingsRepo.insertReading(trx, {
      specId: spec.id,
      position: input.position,
      kind,
      value: input.value,
      unit: input.unit,
      stage,
      wrench: wrench.wrench,
      wrenchId: wrench.wrenchId,
      wrenchCalibratedOn: wrench.calibratedOn,
      wrenchCalibrationDueOn: wrench.dueOn,
      note: input.note ?? '',
      userId: caller.userId,
      takenAt,
    });
    if (kind === 'install') await stepsRepo.markUnderWay(trx, step.id);
    const { verdict } = judgeTorque(input, spec);
    // A stage is a way to the final torque: only final and re-check readings send notices.
    if (stage === null && verdict !== 'in-spec') {
      await notifyTorqueOutOfSpec(trx, {
        buildId,
        stepId: step.id,
        stepTitle: step.title,
        specName: spec.name,
        spec,
        positionLabel: positionLabel(spec.positionNames, input.position),
        verdict,
        value: input.value,
        unit: input.unit,
        retorque: kind === 'retorque',
        actorUserId: caller.userId,
      });
    }
    return result;
  });
  const reading = presentReading((await readingsRepo.findReading(knex, id))!, spec);
  const warnings: string[] = [];
  if (reading.calibration?.overdue) {
    warnings.push(
      `${reading.wrench} was due for calibration on ${reading.calibration.dueOn}: check this reading with a calibrated wrench.`,
    );
  }
  return { reading, supersededId, warnings, fastener: await presentOne(scope, spec.id) };
}
