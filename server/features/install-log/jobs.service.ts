/** Jobs: the ordered top level of a build's install log, each a list of steps. */
import type { CreateJobInput, Job, UpdateJobInput } from '@shared/schemas/install-log';
import { NotFoundError } from '@server/lib/errors';
import type { BuildScope } from '@server/lib/scope';
import * as files from '@server/features/files';
import { loadJob, visibleSteps } from './access';
import * as repo from './jobs.repository';
import { lockOrdering } from './ordering.repository';
import * as fastenersRepo from './fasteners.repository';
import { assembleSteps, numberAsSeen, summarizeSteps, summarize } from './steps.detail';
import * as stepsRepo from './steps.repository';

/**
 * Every job with its step summaries; a shop gets only jobs holding steps it may see, the
 * steps numbered as it sees them. Two statements whatever the build's size: jobs with
 * their steps and checklist counts, and the specs with their current readings.
 */
export async function listJobs(scope: BuildScope): Promise<Job[]> {
  const shop = scope.caller.role === 'shop';
  const [jobs, specs] = await Promise.all([
    repo.listJobsWithSteps(scope.knex, scope.buildId, shop ? scope.caller.userId : null),
    fastenersRepo.listSpecsWithCurrentReadings(scope.knex, scope.buildId),
  ]);
  const specsByStep = new Map<string, fastenersRepo.SpecWithCurrent[]>();
  for (const f of specs) {
    const list = specsByStep.get(f.spec.stepId);
    if (list) list.push(f);
    else specsByStep.set(f.spec.stepId, [f]);
  }
  const listed = jobs.map((j) => {
    const steps = summarizeSteps(j.steps, specsByStep);
    return { ...j, steps: shop ? numberAsSeen(steps) : steps };
  });
  return shop ? listed.filter((j) => j.steps.length > 0) : listed;
}

export async function getJob(scope: BuildScope, rawJobId: string): Promise<Job> {
  const { knex, buildId } = scope;
  const job = await loadJob(scope, rawJobId);
  const visible = await visibleSteps(scope);
  const steps = (await stepsRepo.listSteps(knex, buildId, { jobId: job.id })).filter(
    (s) => !visible || visible.has(s.id),
  );
  if (visible && steps.length === 0) throw new NotFoundError('Job not found');
  const summaries = (await assembleSteps(scope, steps)).map(summarize);
  return { ...job, steps: visible ? numberAsSeen(summaries) : summaries };
}

export async function createJob(scope: BuildScope, input: CreateJobInput) {
  const { knex, buildId, caller } = scope;
  const id = await knex.transaction(async (trx) => {
    const order = await lockOrdering(trx, buildId);
    const position = await order.nextPosition('install_jobs', buildId);
    return repo.insertJob(trx, buildId, { ...input, position, createdBy: caller.userId });
  });
  return getJob(scope, id);
}

export async function updateJob(scope: BuildScope, rawJobId: string, input: UpdateJobInput) {
  const { knex, buildId } = scope;
  const job = await loadJob(scope, rawJobId);
  await knex.transaction(async (trx) => {
    const order = await lockOrdering(trx, buildId);
    // Deleted while this request waited for the lock: 404.
    await loadJob({ ...scope, knex: trx }, job.id);
    await repo.updateJob(trx, job.id, input);
    if (input.position !== undefined) {
      await order.moveTo('install_jobs', buildId, job.id, input.position);
    }
  });
  return getJob(scope, job.id);
}

/** The job, its steps and their photos by cascade; the photos' files are queued in the same transaction. */
export async function deleteJob(
  scope: BuildScope,
  store: Omit<files.FilesCtx, 'knex'>,
  rawJobId: string,
) {
  const { knex, buildId } = scope;
  const job = await loadJob(scope, rawJobId);
  await knex.transaction(async (trx) => {
    const order = await lockOrdering(trx, buildId);
    await repo.deleteJob(trx, job.id);
    await order.closeGaps('install_jobs', buildId);
  });
  await files.purgeSoon({ knex, ...store });
}
