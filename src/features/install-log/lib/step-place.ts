import { openReadingKind } from '@shared/install-log/retorque';
import type { Role } from '@shared/permissions';
import type { FastenerSpec, Job, Step } from '@shared/schemas/install-log';

/**
 * "Fit the injectors · step 2 of 5". A shop sees only the steps that use its parts, numbered
 * among those (the server numbers them so), and is told so.
 */
export function stepPlace(step: Pick<Step, 'position'>, job: Job | undefined, role: Role) {
  if (!job) return `Step ${step.position}`;
  const n = job.steps.length;
  return role === 'shop'
    ? `${job.title} · step ${step.position} of the ${n === 1 ? 'one' : n} using your parts`
    : `${job.title} · step ${step.position} of ${n}`;
}

/** What a fastener card lets this member do: record fitting readings, re-checks, or only read. */
export function fastenerMode(step: Step, spec: FastenerSpec, canWrite: boolean) {
  if (!canWrite) return 'read-only' as const;
  const kind = openReadingKind({
    signedOff: step.status === 'signed-off',
    retorqueAsked: spec.retorque.asked,
  });
  if (kind === 'install') return 'fitting' as const;
  return kind === 'retorque' && !spec.retorque.closedAt
    ? ('retorque' as const)
    : ('read-only' as const);
}
