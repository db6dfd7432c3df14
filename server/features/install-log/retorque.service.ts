/**
 * Re-torque checks: a spec that asks for a second pass after heat cycles or
 * miles gets a check once its step is signed off; the check closes when every
 * position re-reads in spec, or by hand with a note.
 */
import { asksRetorque, describeRetorque, retorqueState } from '@shared/install-log/retorque';
import { judgeTorque, type Verdict } from '@shared/install-log/torque';
import type { CloseRetorqueInput, RetorqueCheck } from '@shared/schemas/install-log';
import { ConflictError, NotFoundError } from '@server/lib/errors';
import type { BuildScope } from '@server/lib/scope';
import { visibleSteps } from './access';
import { loadSpec } from './fasteners.service';
import * as readingsRepo from './readings.repository';
import * as repo from './retorque.repository';

export const retorqueFilters = ['open', 'all'] as const;

/** The build's checks (a shop: those on steps it may see); `open` leaves out waiting and done ones. */
export async function listRetorqueChecks(
  scope: BuildScope,
  filter: (typeof retorqueFilters)[number],
): Promise<RetorqueCheck[]> {
  const { knex, buildId } = scope;
  const [rows, visible] = await Promise.all([
    repo.listRetorqueSpecs(knex, buildId),
    visibleSteps(scope),
  ]);
  const shown = visible ? rows.filter((r) => visible.has(r.spec.stepId)) : rows;
  const readings = await readingsRepo.listReadings(
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
      positionNames: r.spec.positionNames,
      closedAt: r.spec.retorqueClosedAt,
      closedBy: r.spec.retorqueClosedBy,
      closeNote: r.spec.retorqueCloseNote,
    };
  });
  return filter === 'all' ? checks : checks.filter((c) => c.state === 'open');
}

/** Closes an open check by hand, with a note saying how it was re-checked. */
export async function closeRetorqueCheck(
  scope: BuildScope,
  rawSpecId: string,
  input: CloseRetorqueInput,
) {
  const { spec } = await loadSpec(scope, rawSpecId);
  if (!asksRetorque(spec)) throw new NotFoundError('This fastener has no re-torque check');
  const check = (await listRetorqueChecks(scope, 'all')).find((c) => c.specId === spec.id)!;
  if (check.state === 'waiting') {
    throw new ConflictError(
      'step_not_signed_off',
      'Re-torque checks come after the step is signed off',
    );
  }
  if (check.closedAt)
    throw new ConflictError('already_closed', 'This re-torque check is already closed');
  await repo.closeRetorque(scope.knex, spec.id, scope.caller.userId, input.note);
  return (await listRetorqueChecks(scope, 'all')).find((c) => c.specId === spec.id)!;
}
