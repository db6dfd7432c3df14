/**
 * A step in full, as the API shows it: its parts, checklist, fasteners with
 * readings, cautions, sign-off blockers, progress and photo count; and the
 * summary of it that a job lists.
 */
import { cautionsForStep } from '@shared/install-log/cautions';
import { signOffBlockers } from '@shared/install-log/sign-off';
import { judgeTorque } from '@shared/install-log/torque';
import type { ChecklistItem, SignOff, Step, StepSummary } from '@shared/schemas/install-log';
import type { BuildScope } from '@server/lib/scope';
import { visibleSteps } from './access';
import { seesPart } from '@server/features/parts';
import * as checklistRepo from './checklist.repository';
import * as fastenersRepo from './fasteners.repository';
import type * as jobsRepo from './jobs.repository';
import { presentSpec } from './fasteners.present';
import * as readingsRepo from './readings.repository';
import * as stepPartsRepo from './step-parts.repository';
import * as stepsRepo from './steps.repository';

/** A step's sign-off as the API shows it, with the override's reason when there was one. */
function signOffOf(
  s: Pick<
    stepsRepo.StepRecord,
    'signedOffAt' | 'signedOffBy' | 'overrideReason' | 'overrideBlockers'
  >,
): SignOff | null {
  if (!s.signedOffAt) return null;
  return {
    by: s.signedOffBy,
    at: s.signedOffAt,
    override: s.overrideReason
      ? { reason: s.overrideReason, blockers: s.overrideBlockers ?? [] }
      : null,
  };
}

/**
 * Numbers steps as the caller sees them: 1, 2, 3 … within each job, in the order given. A
 * shop sees only the steps linked to its parts; their places in the whole job ("step 3" of
 * two it can see) would read as nonsense, and would hint at steps it may not see.
 */
export function numberAsSeen<T extends { jobId: string; position: number }>(steps: T[]): T[] {
  const next = new Map<string, number>();
  return steps.map((s) => {
    const position = (next.get(s.jobId) ?? 0) + 1;
    next.set(s.jobId, position);
    return { ...s, position };
  });
}

/**
 * Full steps with their parts, checklist, fasteners, readings, cautions and
 * blockers. Parts are those the caller may see (a shop: only parts sent to it,
 * as in the parts ledger); cautions still weigh every linked part, as they are
 * about the work, not the parts.
 */
export async function assembleSteps(
  { knex, caller }: BuildScope,
  steps: stepsRepo.StepRecord[],
): Promise<Step[]> {
  const ids = steps.map((s) => s.id);
  // One after another: inside a transaction there is one connection, which runs one query at a time.
  const links = await stepPartsRepo.listStepParts(knex, ids);
  const checklist = await checklistRepo.listChecklist(knex, ids);
  const specs = await fastenersRepo.listSpecs(knex, ids);
  const photoCounts = await stepsRepo.countPhotosByStep(knex, ids);
  const readings = await readingsRepo.listReadings(
    knex,
    specs.map((s) => s.id),
  );
  return steps.map((s) => {
    const linked = links.filter((l) => l.stepId === s.id);
    const parts = linked
      .filter((l) => seesPart(caller, l))
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
      cautionChoice: s.cautionChoice,
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
        partCategories: linked.map((p) => p.category),
        liftsVehicle: s.liftsVehicle,
        fastenerCount: fasteners.length,
        chosen: s.cautionChoice,
      }),
      signOff: signOffOf(s),
      signOffBlockers: blockers,
      photoCount: photoCounts.get(s.id) ?? 0,
      createdAt: s.createdAt,
      updatedAt: s.updatedAt,
    };
  });
}

export function summarize(step: Step): StepSummary {
  return {
    id: step.id,
    jobId: step.jobId,
    position: step.position,
    title: step.title,
    status: step.status,
    signedOffAt: step.signOff?.at ?? null,
    signOff: step.signOff,
    progress: step.progress,
  };
}

/**
 * The summaries of a job list's steps (the steps a caller may see, with checklist counts:
 * jobsRepo.listJobsWithSteps), their fastener progress judged here from the specs' current
 * readings (fastenersRepo.listSpecsWithCurrentReadings) alike with the full step view.
 */
export function summarizeSteps(
  steps: jobsRepo.StepCounts[],
  specsByStep: Map<string, fastenersRepo.SpecWithCurrent[]>,
): StepSummary[] {
  return steps.map((s): StepSummary => {
    const mine = specsByStep.get(s.id) ?? [];
    const current = mine.flatMap(({ spec, current }) =>
      current.filter((r) => r.position <= spec.count).map((r) => judgeTorque(r, spec).verdict),
    );
    return {
      id: s.id,
      jobId: s.jobId,
      position: s.position,
      title: s.title,
      status: s.status,
      signedOffAt: s.signedOffAt,
      signOff: signOffOf(s),
      progress: {
        checklistDone: s.checklistDone,
        checklistTotal: s.checklistTotal,
        positionsRecorded: current.length,
        positionsTotal: mine.reduce((n, f) => n + f.spec.count, 0),
        outOfSpec: current.filter((v) => v !== 'in-spec').length,
      },
    };
  });
}

/**
 * One step in full; the caller has already been shown it exists and is visible (loadStep).
 * For a shop, its position is its place among the steps of its job the shop may see.
 */
export async function stepDetail(scope: BuildScope, stepId: string) {
  const step = (await stepsRepo.findStep(scope.knex, scope.buildId, stepId))!;
  const [detail] = await assembleSteps(scope, [step]);
  const visible = await visibleSteps(scope);
  if (!visible) return detail;
  const seen = (await stepsRepo.listSteps(scope.knex, scope.buildId, { jobId: step.jobId }))
    .filter((s) => visible.has(s.id))
    .map((s) => s.id);
  return { ...detail, position: seen.indexOf(step.id) + 1 };
}
