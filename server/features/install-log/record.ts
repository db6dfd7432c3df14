/** The whole install log in full, for the build sheet and the public page (sharing). */
import type { Step } from '@shared/schemas/install-log';
import type { BuildScope } from '@server/lib/scope';
import * as jobsRepo from './jobs.repository';
import { assembleSteps } from './steps.detail';
import * as stepsRepo from './steps.repository';

/** Every job in order with its steps in full: checklist, fasteners with judged readings, sign-off. */
export async function installRecord(
  scope: BuildScope,
): Promise<{ title: string; steps: Step[] }[]> {
  const jobs = await jobsRepo.listJobs(scope.knex, scope.buildId);
  const steps = await assembleSteps(scope, await stepsRepo.listSteps(scope.knex, scope.buildId));
  return jobs.map((j) => ({ title: j.title, steps: steps.filter((s) => s.jobId === j.id) }));
}
