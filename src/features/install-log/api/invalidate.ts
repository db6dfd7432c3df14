import type { QueryClient } from '@tanstack/react-query';
import type { FastenerSpec, Step } from '@shared/schemas/install-log';
import { getJobsQueryOptions } from './get-jobs';
import { getReadingsQueryOptions } from './get-readings';
import { getRetorqueChecksQueryOptions } from './get-retorque-checks';
import { getStepQueryOptions } from './get-step';

/**
 * After any install-log change: the step (when known), the jobs list (its progress counts)
 * and the re-torque checks all may have moved.
 */
export async function invalidateInstallLog(
  queryClient: QueryClient,
  buildId: string,
  stepId?: string,
): Promise<void> {
  await Promise.all([
    stepId
      ? queryClient.invalidateQueries({ queryKey: getStepQueryOptions(buildId, stepId).queryKey })
      : undefined,
    queryClient.invalidateQueries({ queryKey: getJobsQueryOptions(buildId).queryKey }),
    queryClient.invalidateQueries({
      queryKey: getRetorqueChecksQueryOptions(buildId, 'open').queryKey.slice(0, 4),
    }),
  ]);
}

/** Puts a step the server just returned into the cache, so the page shows it at once. */
export function setCachedStep(queryClient: QueryClient, step: Step): void {
  queryClient.setQueryData(getStepQueryOptions(step.buildId, step.id).queryKey, step);
}

/** Replaces one fastener inside its cached step (a reading changes only that fastener). */
export function setCachedFastener(
  queryClient: QueryClient,
  buildId: string,
  fastener: FastenerSpec,
): void {
  queryClient.setQueryData(getStepQueryOptions(buildId, fastener.stepId).queryKey, (step) =>
    step
      ? {
          ...step,
          fasteners: step.fasteners.map((f) => (f.id === fastener.id ? fastener : f)),
        }
      : step,
  );
}

export async function invalidateReadings(
  queryClient: QueryClient,
  buildId: string,
  specId: string,
): Promise<void> {
  await queryClient.invalidateQueries({
    queryKey: getReadingsQueryOptions(buildId, specId).queryKey,
  });
}
