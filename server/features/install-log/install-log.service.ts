/**
 * Install-log rules: who sees which steps, when a step may change, how readings
 * supersede each other and when a step may be signed off. Pure judgements
 * (torque verdicts, sign-off blockers, re-torque state, cautions) come from
 * shared/install-log so the client can show the same thing before it asks.
 */
import type { Knex } from 'knex';
import { cautionsForStep } from '../../../shared/install-log/cautions';
import {
  asksRetorque,
  describeRetorque,
  retorqueState,
} from '../../../shared/install-log/retorque';
import { signOffBlockers, type SignOffBlocker } from '../../../shared/install-log/sign-off';
import {
  judgeTorque,
  otherSystemUnit,
  restateTarget,
  toleranceBand,
  type Verdict,
} from '../../../shared/install-log/torque';
import type { Role } from '../../../shared/permissions';
import { can } from '../../../shared/permissions';
import { idSchema } from '../../../shared/schemas/common';
import {
  fastenerSpecIssues,
  torqueDefiningFields,
  type ChecklistItem,
  type CloseRetorqueInput,
  type CreateChecklistItemInput,
  type CreateFastenerSpecInput,
  type CreateJobInput,
  type CreateReadingInput,
  type CreateStepInput,
  type FastenerSpec,
  type Job,
  type RetorqueCheck,
  type SignOffInput,
  type Step,
  type StepSummary,
  type TorqueReading,
  type UpdateChecklistItemInput,
  type UpdateFastenerSpecInput,
  type UpdateJobInput,
  type UpdateStepInput,
} from '../../../shared/schemas/install-log';
import { ConflictError, ForbiddenError, NotFoundError, ValidationError } from '../../lib/errors';
import type { Storage } from '../../lib/storage';
import type { Logger } from '../../lib/logger';
import * as files from '../files';
import * as repo from './install-log.repository';
import { notifyStepSignedOff, notifyTorqueOutOfSpec } from './install-log.notices';

export type Caller = { userId: string; role: Role };
/** What deletes need beyond the database: the photo store, to remove files. */
export type FileCtx = { storage: Storage; logger: Logger };

function parseId(raw: string, what: string) {
  const parsed = idSchema.safeParse(raw);
  if (!parsed.success) throw new NotFoundError(`${what} not found`);
  return parsed.data;
}

/** Steps a caller may read: all of them, or for a shop only those linked to its parts. */
export async function visibleSteps(
  knex: Knex,
  buildId: string,
  caller: Caller,
): Promise<Set<string> | null> {
  return caller.role === 'shop' ? repo.stepIdsForShop(knex, buildId, caller.userId) : null;
}

/** A step the caller may see (a shop: only steps linked to its parts), or 404. */
export async function loadStep(knex: Knex, buildId: string, rawStepId: string, caller: Caller) {
  const step = await repo.findStep(knex, buildId, parseId(rawStepId, 'Step'));
  if (!step) throw new NotFoundError('Step not found');
  if (
    caller.role === 'shop' &&
    !(await repo.stepIdsForShop(knex, buildId, caller.userId)).has(step.id)
  ) {
    // Another step is as invisible to a shop as a step that does not exist.
    throw new NotFoundError('Step not found');
  }
  return step;
}

async function loadJob(knex: Knex, buildId: string, rawJobId: string) {
  const job = await repo.findJob(knex, buildId, parseId(rawJobId, 'Job'));
  if (!job) throw new NotFoundError('Job not found');
  return job;
}

async function loadSpec(knex: Knex, buildId: string, rawSpecId: string, caller: Caller) {
  const spec = await repo.findSpec(knex, buildId, parseId(rawSpecId, 'Fastener'));
  if (!spec) throw new NotFoundError('Fastener not found');
  const step = await loadStep(knex, buildId, spec.stepId, caller).catch(
    renameNotFound('Fastener not found'),
  );
  return { spec, step };
}

/** A hidden step makes what hangs off it not found too, under its own name. */
function renameNotFound(message: string) {
  return (err: unknown): never => {
    throw err instanceof NotFoundError ? new NotFoundError(message) : err;
  };
}

function assertOpen(step: { status: string }) {
  if (step.status === 'signed-off') {
    throw new ConflictError(
      'step_signed_off',
      'This step is signed off. The owner can reopen it to change it.',
    );
  }
}

// ---- presenting -------------------------------------------------------------------

function presentReading(r: repo.ReadingRecord, spec: repo.SpecRecord): TorqueReading {
  return { ...r, ...judgeTorque(r, spec) };
}

function presentSpec(spec: repo.SpecRecord, readings: repo.ReadingRecord[]): FastenerSpec {
  const judged = readings.filter((r) => r.specId === spec.id).map((r) => presentReading(r, spec));
  const positions = [];
  for (let position = 1; position <= spec.count; position++) {
    const here = judged.filter((r) => r.position === position);
    positions.push({
      position,
      current: here.find((r) => r.kind === 'install' && !r.supersededAt) ?? null,
      retorque: here.find((r) => r.kind === 'retorque' && !r.supersededAt) ?? null,
      supersededCount: here.filter((r) => r.supersededAt).length,
    });
  }
  const { retorqueClosedAt, retorqueClosedBy, retorqueCloseNote, ...fields } = spec;
  return {
    ...fields,
    band: toleranceBand(spec),
    alt: restateTarget(spec, otherSystemUnit(spec.targetUnit)),
    positions,
    retorque: {
      asked: asksRetorque(spec),
      description: describeRetorque(spec),
      closedAt: retorqueClosedAt,
      closedBy: retorqueClosedBy,
      closeNote: retorqueCloseNote,
    },
  };
}

/** Full steps with their parts, checklist, fasteners, readings, cautions and blockers. */
async function assembleSteps(knex: Knex, steps: repo.StepRecord[]): Promise<Step[]> {
  const ids = steps.map((s) => s.id);
  // One after another: inside a transaction there is one connection, which runs one query at a time.
  const links = await repo.listStepParts(knex, ids);
  const checklist = await repo.listChecklist(knex, ids);
  const specs = await repo.listSpecs(knex, ids);
  const photoCounts = await repo.countPhotosByStep(knex, ids);
  const readings = await repo.listReadings(
    knex,
    specs.map((s) => s.id),
  );
  return steps.map((s) => {
    const parts = links
      .filter((l) => l.stepId === s.id)
      .map(({ id, name, category, status }) => ({ id, name, category, status }));
    const items: ChecklistItem[] = checklist.filter((c) => c.stepId === s.id);
    const fasteners = specs.filter((f) => f.stepId === s.id).map((f) => presentSpec(f, readings));
    const blockers =
      s.status === 'signed-off' ? [] : signOffBlockers({ fasteners, checklist: items });
    const positionsTotal = fasteners.reduce((n, f) => n + f.count, 0);
    const current = fasteners.flatMap((f) =>
      f.positions.map((p) => p.current).filter((c) => c != null),
    );
    return {
      id: s.id,
      buildId: s.buildId,
      jobId: s.jobId,
      position: s.position,
      title: s.title,
      description: s.description,
      liftsVehicle: s.liftsVehicle,
      status: s.status,
      progress: {
        checklistDone: items.filter((i) => i.done).length,
        checklistTotal: items.length,
        positionsRecorded: current.length,
        positionsTotal,
        outOfSpec: current.filter((c) => c.verdict !== 'in-spec').length,
      },
      parts,
      checklist: items,
      fasteners,
      cautions: cautionsForStep({
        title: s.title,
        description: s.description,
        partCategories: parts.map((p) => p.category),
        liftsVehicle: s.liftsVehicle,
        fastenerCount: fasteners.length,
      }),
      signOff: s.signedOffAt
        ? {
            by: s.signedOffBy,
            at: s.signedOffAt,
            override: s.overrideReason
              ? { reason: s.overrideReason, blockers: s.overrideBlockers ?? [] }
              : null,
          }
        : null,
      signOffBlockers: blockers,
      photoCount: photoCounts.get(s.id) ?? 0,
      createdAt: s.createdAt,
      updatedAt: s.updatedAt,
    };
  });
}

function summarize(step: Step): StepSummary {
  return {
    id: step.id,
    jobId: step.jobId,
    position: step.position,
    title: step.title,
    status: step.status,
    signedOffAt: step.signOff?.at ?? null,
    progress: step.progress,
  };
}

async function stepDetail(knex: Knex, buildId: string, stepId: string) {
  const [step] = await assembleSteps(knex, [(await repo.findStep(knex, buildId, stepId))!]);
  return step;
}

// ---- jobs -----------------------------------------------------------------------

export async function listJobs(knex: Knex, buildId: string, caller: Caller): Promise<Job[]> {
  const [jobs, steps, visible] = await Promise.all([
    repo.listJobs(knex, buildId),
    repo.listSteps(knex, buildId),
    visibleSteps(knex, buildId, caller),
  ]);
  const shown = visible ? steps.filter((s) => visible.has(s.id)) : steps;
  const full = await assembleSteps(knex, shown);
  return jobs
    .map((j) => ({ ...j, steps: full.filter((s) => s.jobId === j.id).map(summarize) }))
    .filter((j) => !visible || j.steps.length > 0);
}

export async function getJob(
  knex: Knex,
  buildId: string,
  rawJobId: string,
  caller: Caller,
): Promise<Job> {
  const job = await loadJob(knex, buildId, rawJobId);
  const visible = await visibleSteps(knex, buildId, caller);
  const steps = (await repo.listSteps(knex, buildId, { jobId: job.id })).filter(
    (s) => !visible || visible.has(s.id),
  );
  if (visible && steps.length === 0) throw new NotFoundError('Job not found');
  return { ...job, steps: (await assembleSteps(knex, steps)).map(summarize) };
}

export async function createJob(
  knex: Knex,
  buildId: string,
  caller: Caller,
  input: CreateJobInput,
) {
  const id = await knex.transaction(async (trx) => {
    await repo.lockParent(trx, 'install_jobs', buildId);
    const position = await repo.nextPosition(trx, 'install_jobs', buildId);
    return repo.insertJob(trx, buildId, { ...input, position, createdBy: caller.userId });
  });
  return getJob(knex, buildId, id, caller);
}

export async function updateJob(
  knex: Knex,
  buildId: string,
  rawJobId: string,
  caller: Caller,
  input: UpdateJobInput,
) {
  const job = await loadJob(knex, buildId, rawJobId);
  await knex.transaction(async (trx) => {
    await repo.updateJob(trx, job.id, input);
    if (input.position !== undefined) {
      await repo.lockParent(trx, 'install_jobs', buildId);
      await repo.moveTo(trx, 'install_jobs', buildId, job.id, input.position);
    }
  });
  return getJob(knex, buildId, job.id, caller);
}

export async function deleteJob(knex: Knex, ctx: FileCtx, buildId: string, rawJobId: string) {
  const job = await loadJob(knex, buildId, rawJobId);
  // Steps and their photos go by cascade; the photos' files are queued in the same transaction.
  await knex.transaction(async (trx) => {
    await repo.lockParent(trx, 'install_jobs', buildId);
    await repo.deleteJob(trx, job.id);
    await repo.closeGaps(trx, 'install_jobs', buildId);
  });
  await files.purgeSoon({ knex, ...ctx });
}

// ---- steps --------------------------------------------------------------------------

async function checkParts(knex: Knex, buildId: string, partIds: string[] | undefined) {
  if (!partIds?.length) return;
  const unique = [...new Set(partIds)];
  if ((await repo.countBuildParts(knex, buildId, unique)) !== unique.length) {
    throw new ValidationError('A linked part is not a part of this build', {
      partIds: 'Choose parts from this build',
    });
  }
}

export async function createStep(
  knex: Knex,
  buildId: string,
  rawJobId: string,
  caller: Caller,
  input: CreateStepInput,
) {
  const job = await loadJob(knex, buildId, rawJobId);
  await checkParts(knex, buildId, input.partIds);
  const id = await knex.transaction(async (trx) => {
    await repo.lockParent(trx, 'install_steps', job.id);
    const last = await repo.nextPosition(trx, 'install_steps', job.id);
    const stepId = await repo.insertStep(trx, buildId, job.id, { ...input, position: last });
    if (input.position !== undefined && input.position < last) {
      await repo.moveTo(trx, 'install_steps', job.id, stepId, input.position);
    }
    if (input.partIds) await repo.setStepParts(trx, stepId, input.partIds);
    return stepId;
  });
  return getStep(knex, buildId, id, caller);
}

export async function getStep(knex: Knex, buildId: string, rawStepId: string, caller: Caller) {
  const step = await loadStep(knex, buildId, rawStepId, caller);
  return stepDetail(knex, buildId, step.id);
}

export async function updateStep(
  knex: Knex,
  buildId: string,
  rawStepId: string,
  caller: Caller,
  input: UpdateStepInput,
) {
  const step = await loadStep(knex, buildId, rawStepId, caller);
  if (input.status !== undefined) assertOpen(step);
  await checkParts(knex, buildId, input.partIds);
  await knex.transaction(async (trx) => {
    const status = await repo.lockStep(trx, step.id);
    if (input.status !== undefined) assertOpen({ status: status ?? '' });
    await repo.updateStep(trx, step.id, input);
    if (input.partIds) await repo.setStepParts(trx, step.id, input.partIds);
    if (input.position !== undefined) {
      await repo.lockParent(trx, 'install_steps', step.jobId);
      await repo.moveTo(trx, 'install_steps', step.jobId, step.id, input.position);
    }
  });
  return stepDetail(knex, buildId, step.id);
}

export async function deleteStep(
  knex: Knex,
  ctx: FileCtx,
  buildId: string,
  rawStepId: string,
  caller: Caller,
) {
  const step = await loadStep(knex, buildId, rawStepId, caller);
  await knex.transaction(async (trx) => {
    await repo.lockParent(trx, 'install_steps', step.jobId);
    await repo.deleteStep(trx, step.id);
    await repo.closeGaps(trx, 'install_steps', step.jobId);
  });
  await files.purgeSoon({ knex, ...ctx });
}

// ---- checklist --------------------------------------------------------------------------

export async function addChecklistItem(
  knex: Knex,
  buildId: string,
  rawStepId: string,
  caller: Caller,
  input: CreateChecklistItemInput,
) {
  const step = await loadStep(knex, buildId, rawStepId, caller);
  const id = await knex.transaction(async (trx) => {
    assertOpen({ status: (await repo.lockStep(trx, step.id)) ?? '' });
    const position = await repo.nextPosition(trx, 'install_checklist_items', step.id);
    return repo.insertChecklistItem(trx, step.id, input.label, position);
  });
  return (await repo.findChecklistItem(knex, buildId, id))!;
}

async function loadItem(knex: Knex, buildId: string, rawItemId: string, caller: Caller) {
  const item = await repo.findChecklistItem(knex, buildId, parseId(rawItemId, 'Checklist item'));
  if (!item) throw new NotFoundError('Checklist item not found');
  const step = await loadStep(knex, buildId, item.stepId, caller).catch(
    renameNotFound('Checklist item not found'),
  );
  return { item, step };
}

export async function updateChecklistItem(
  knex: Knex,
  buildId: string,
  rawItemId: string,
  caller: Caller,
  input: UpdateChecklistItemInput,
) {
  const { item, step } = await loadItem(knex, buildId, rawItemId, caller);
  await knex.transaction(async (trx) => {
    assertOpen({ status: (await repo.lockStep(trx, step.id)) ?? '' });
    await repo.updateChecklistItem(trx, item.id, { ...input, userId: caller.userId });
    if (input.done) await repo.markUnderWay(trx, step.id);
  });
  return (await repo.findChecklistItem(knex, buildId, item.id))!;
}

export async function deleteChecklistItem(
  knex: Knex,
  buildId: string,
  rawItemId: string,
  caller: Caller,
) {
  const { item, step } = await loadItem(knex, buildId, rawItemId, caller);
  await knex.transaction(async (trx) => {
    assertOpen({ status: (await repo.lockStep(trx, step.id)) ?? '' });
    await repo.deleteChecklistItem(trx, item.id);
    await repo.closeGaps(trx, 'install_checklist_items', step.id);
  });
}

// ---- fastener specs ---------------------------------------------------------------------

function checkSpec(merged: Record<string, unknown>) {
  const issues = fastenerSpecIssues(merged);
  if (Object.keys(issues).length)
    throw new ValidationError('Some fields contradict each other', issues);
}

async function presentOne(knex: Knex, buildId: string, specId: string) {
  const spec = (await repo.findSpec(knex, buildId, specId))!;
  return presentSpec(spec, await repo.listReadings(knex, [spec.id]));
}

export async function addFastener(
  knex: Knex,
  buildId: string,
  rawStepId: string,
  caller: Caller,
  input: CreateFastenerSpecInput,
) {
  const step = await loadStep(knex, buildId, rawStepId, caller);
  checkSpec(input);
  const { position, ...fields } = input;
  const id = await knex.transaction(async (trx) => {
    assertOpen({ status: (await repo.lockStep(trx, step.id)) ?? '' });
    const last = await repo.nextPosition(trx, 'fastener_specs', step.id);
    const specId = await repo.insertSpec(trx, step.id, fields, last);
    if (position !== undefined && position < last) {
      await repo.moveTo(trx, 'fastener_specs', step.id, specId, position);
    }
    return specId;
  });
  return presentOne(knex, buildId, id);
}

export async function updateFastener(
  knex: Knex,
  buildId: string,
  rawSpecId: string,
  caller: Caller,
  input: UpdateFastenerSpecInput,
) {
  const { spec, step } = await loadSpec(knex, buildId, rawSpecId, caller);
  checkSpec({ ...spec, ...input });
  await knex.transaction(async (trx) => {
    assertOpen({ status: (await repo.lockStep(trx, step.id)) ?? '' });
    const changesTorque = torqueDefiningFields.some(
      (k) => input[k] !== undefined && input[k] !== spec[k],
    );
    // Changing the target under recorded readings changes their verdicts: the owner's call only.
    if (
      changesTorque &&
      !can(caller.role, 'install:override') &&
      (await repo.specHasReadings(trx, spec.id))
    ) {
      throw new ForbiddenError(
        'This fastener already has readings; only the owner can change its target or tolerance',
      );
    }
    // Fewer fasteners than positions already torqued would hide those readings.
    if (input.count !== undefined && input.count < spec.count) {
      const highest = await repo.highestReadPosition(trx, spec.id);
      if (input.count < highest) {
        throw new ValidationError('Readings exist for higher positions', {
          count: `Position ${highest} already has a reading; keep at least ${highest}`,
        });
      }
    }
    await repo.updateSpec(trx, spec.id, input);
  });
  return presentOne(knex, buildId, spec.id);
}

export async function deleteFastener(
  knex: Knex,
  buildId: string,
  rawSpecId: string,
  caller: Caller,
) {
  const { spec, step } = await loadSpec(knex, buildId, rawSpecId, caller);
  await knex.transaction(async (trx) => {
    assertOpen({ status: (await repo.lockStep(trx, step.id)) ?? '' });
    await repo.deleteSpec(trx, spec.id);
    await repo.closeGaps(trx, 'fastener_specs', step.id);
  });
}

// ---- readings -------------------------------------------------------------------------------

/** Every reading of a fastener, newest first per position, superseded ones included. */
export async function listReadings(knex: Knex, buildId: string, rawSpecId: string, caller: Caller) {
  const { spec } = await loadSpec(knex, buildId, rawSpecId, caller);
  const readings = await repo.listReadings(knex, [spec.id]);
  return {
    fastener: presentSpec(spec, readings),
    readings: readings.map((r) => presentReading(r, spec)),
  };
}

/**
 * Records a reading. Supersede rule: the new reading replaces the current one
 * of the same fastener, position and kind (fitting or re-torque); the old one
 * is kept, marked superseded by the new one. Fitting readings are refused on a
 * signed-off step; re-torque readings need a signed-off step and a spec that
 * asks for a re-check.
 */
export async function recordReading(
  knex: Knex,
  buildId: string,
  rawSpecId: string,
  caller: Caller,
  input: CreateReadingInput,
) {
  const { spec, step } = await loadSpec(knex, buildId, rawSpecId, caller);
  if (input.position > spec.count) {
    throw new ValidationError(
      `${spec.name} has ${spec.count} position${spec.count === 1 ? '' : 's'}`,
      {
        position: `Choose a position from 1 to ${spec.count}`,
      },
    );
  }
  const kind = input.retorque ? 'retorque' : 'install';
  if (kind === 'retorque' && !asksRetorque(spec)) {
    throw new ValidationError('This fastener asks for no re-torque check', {
      retorque: 'Record it as a fitting reading',
    });
  }
  const { id, supersededId } = await knex.transaction(async (trx) => {
    const status = await repo.lockStep(trx, step.id);
    if (kind === 'install') assertOpen({ status: status ?? '' });
    else if (status !== 'signed-off') {
      throw new ConflictError(
        'step_not_signed_off',
        'Re-torque checks come after the step is signed off',
      );
    }
    const result = await repo.insertReading(trx, {
      specId: spec.id,
      position: input.position,
      kind,
      value: input.value,
      unit: input.unit,
      wrench: input.wrench ?? '',
      note: input.note ?? '',
      userId: caller.userId,
    });
    if (kind === 'install') await repo.markUnderWay(trx, step.id);
    const { verdict } = judgeTorque(input, spec);
    if (verdict !== 'in-spec') {
      await notifyTorqueOutOfSpec(trx, {
        buildId,
        stepId: step.id,
        stepTitle: step.title,
        specName: spec.name,
        spec,
        position: input.position,
        verdict,
        value: input.value,
        unit: input.unit,
        retorque: kind === 'retorque',
        actorUserId: caller.userId,
      });
    }
    return result;
  });
  const reading = presentReading((await repo.findReading(knex, id))!, spec);
  return { reading, supersededId, fastener: await presentOne(knex, buildId, spec.id) };
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
export async function signOff(
  knex: Knex,
  buildId: string,
  rawStepId: string,
  caller: Caller,
  input: SignOffInput,
) {
  const step = await loadStep(knex, buildId, rawStepId, caller);
  if (input.overrideReason !== undefined && !can(caller.role, 'install:override')) {
    throw new ForbiddenError('Only the owner can sign off over out-of-spec or missing readings');
  }
  await knex.transaction(async (trx) => {
    const status = await repo.lockStep(trx, step.id);
    if (status === 'signed-off')
      throw new ConflictError('already_signed_off', 'This step is already signed off');
    const [current] = await assembleSteps(trx, [(await repo.findStep(trx, buildId, step.id))!]);
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
      jobTitle: (await repo.findJob(trx, buildId, step.jobId))?.title ?? '',
      overrideReason: override ? input.overrideReason! : null,
      actorUserId: caller.userId,
    });
  });
  return stepDetail(knex, buildId, step.id);
}

/** Owner only: takes a step back to "under way" so it can be changed; the old sign-off is cleared. */
export async function reopen(knex: Knex, buildId: string, rawStepId: string, caller: Caller) {
  const step = await loadStep(knex, buildId, rawStepId, caller);
  await knex.transaction(async (trx) => {
    const status = await repo.lockStep(trx, step.id);
    if (status !== 'signed-off')
      throw new ConflictError('not_signed_off', 'This step is not signed off');
    await repo.reopenStep(trx, step.id);
  });
  return stepDetail(knex, buildId, step.id);
}

// ---- re-torque checks ---------------------------------------------------------------------------------

export const retorqueFilters = ['open', 'all'] as const;

export async function listRetorqueChecks(
  knex: Knex,
  buildId: string,
  caller: Caller,
  filter: (typeof retorqueFilters)[number],
): Promise<RetorqueCheck[]> {
  const [rows, visible] = await Promise.all([
    repo.listRetorqueSpecs(knex, buildId),
    visibleSteps(knex, buildId, caller),
  ]);
  const shown = visible ? rows.filter((r) => visible.has(r.spec.stepId)) : rows;
  const readings = await repo.listReadings(
    knex,
    shown.map((r) => r.spec.id),
  );
  const checks = shown.map((r): RetorqueCheck => {
    const current: (Verdict | null)[] = [];
    const positionsLeft: number[] = [];
    for (let position = 1; position <= r.spec.count; position++) {
      const reading = readings.find(
        (x) =>
          x.specId === r.spec.id &&
          x.position === position &&
          x.kind === 'retorque' &&
          !x.supersededAt,
      );
      const verdict = reading ? judgeTorque(reading, r.spec).verdict : null;
      current.push(verdict);
      if (verdict !== 'in-spec') positionsLeft.push(position);
    }
    return {
      specId: r.spec.id,
      specName: r.spec.name,
      count: r.spec.count,
      stepId: r.spec.stepId,
      stepTitle: r.stepTitle,
      jobId: r.jobId,
      jobTitle: r.jobTitle,
      state: retorqueState({
        signedOff: r.stepStatus === 'signed-off',
        closed: r.spec.retorqueClosedAt != null,
        count: r.spec.count,
        currentRetorque: current,
      }),
      afterHeatCycles: r.spec.retorqueAfterHeatCycles,
      afterMiles: r.spec.retorqueAfterMiles,
      description: describeRetorque(r.spec),
      since: r.stepSignedOffAt,
      positionsLeft,
      closedAt: r.spec.retorqueClosedAt,
      closedBy: r.spec.retorqueClosedBy,
      closeNote: r.spec.retorqueCloseNote,
    };
  });
  return filter === 'all' ? checks : checks.filter((c) => c.state === 'open');
}

/** Closes an open check by hand, with a note saying how it was re-checked. */
export async function closeRetorqueCheck(
  knex: Knex,
  buildId: string,
  rawSpecId: string,
  caller: Caller,
  input: CloseRetorqueInput,
) {
  const { spec } = await loadSpec(knex, buildId, rawSpecId, caller);
  if (!asksRetorque(spec)) throw new NotFoundError('This fastener has no re-torque check');
  const check = (await listRetorqueChecks(knex, buildId, caller, 'all')).find(
    (c) => c.specId === spec.id,
  )!;
  if (check.state === 'waiting') {
    throw new ConflictError(
      'step_not_signed_off',
      'Re-torque checks come after the step is signed off',
    );
  }
  if (check.closedAt)
    throw new ConflictError('already_closed', 'This re-torque check is already closed');
  await repo.closeRetorque(knex, spec.id, caller.userId, input.note);
  return (await listRetorqueChecks(knex, buildId, caller, 'all')).find(
    (c) => c.specId === spec.id,
  )!;
}
