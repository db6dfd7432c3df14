/**
 * What dyno results are read against: the build's target, the estimator's
 * "most the build supports" and its assumptions (drivetrain loss for wheel ↔
 * crank, BSFC for R85's engine factor), and the engine itself.
 */
import { engineAspirationForBuild, type DynoPlan } from '@shared/schemas/dyno';
import type { BuildScope } from '@server/lib/scope';
import * as builds from '@server/features/builds';
import * as estimate from '@server/features/estimate';

export async function loadPlan({ knex, buildId, caller }: BuildScope): Promise<DynoPlan> {
  const [build, saved, result] = await Promise.all([
    builds.get(knex, buildId, caller.userId),
    estimate.getAssumptions(knex, buildId),
    // A shop gets the estimate with other parts anonymised, so the weakest link's name is safe to show it.
    estimate.estimateBuild(
      knex,
      buildId,
      caller.role === 'shop' ? { shopUserId: caller.userId } : {},
    ),
  ]);
  const a = saved.assumptions;
  return {
    target: {
      powerHp: build.targetPowerHp,
      basis: build.targetPowerBasis,
      torqueLbft: build.targetTorqueLbft,
    },
    supported: result.supported
      ? {
          crankPowerHp: result.supported.crankPower.value,
          wheelPowerHp: result.supported.wheelPower.value,
          limitedBy: result.weakestLink?.name ?? '',
        }
      : null,
    drivetrainLossPct: a.drivetrainLossPct,
    engine: {
      aspiration: engineAspirationForBuild[build.aspiration],
      displacementL: build.displacementLiters,
      bsfc: a.bsfc,
      bsfcUnit: a.bsfcUnit,
      drivetrainLossPct: a.drivetrainLossPct,
    },
  };
}
