import type { Knex } from 'knex';
import { estimate } from '../../../shared/estimate';
import {
  assumptionsInputSchema,
  type Assumptions,
  type AssumptionsResponse,
  type EstimateInput,
  type EstimateResult,
} from '../../../shared/schemas/estimate';
import { convertBsfc } from '../../../shared/units/convert';
import { NotFoundError } from '../../lib/errors';
import * as repo from './estimate.repository';

/** The default assumptions, as the schema fills them in for an empty body. */
function defaults(): Assumptions {
  return assumptionsInputSchema.parse({});
}

/**
 * A stored row back in the unit the owner typed. BSFC is stored in lb/(hp·h);
 * a value typed in g/kWh comes back through two conversions, so it is rounded
 * to 12 significant digits to show 210, not 209.99999999999997.
 */
function fromStored(row: repo.StoredAssumptions): Assumptions {
  const bsfc = convertBsfc(row.bsfcLbPerHpH, 'lb-per-hp-h', row.bsfcEntryUnit);
  return {
    bsfc: Number(bsfc.toPrecision(12)),
    bsfcUnit: row.bsfcEntryUnit,
    afr: row.afr,
    fuelDensityKgPerL: row.fuelDensityKgPerL,
    drivetrainLossPct: row.drivetrainLossPct,
    peakRpm: row.peakRpm,
    tightMarginPct: row.tightMarginPct,
  };
}

function toStored(a: Assumptions): repo.StoredAssumptions {
  return {
    bsfcLbPerHpH: convertBsfc(a.bsfc, a.bsfcUnit, 'lb-per-hp-h'),
    bsfcEntryUnit: a.bsfcUnit,
    afr: a.afr,
    fuelDensityKgPerL: a.fuelDensityKgPerL,
    drivetrainLossPct: a.drivetrainLossPct,
    peakRpm: a.peakRpm,
    tightMarginPct: a.tightMarginPct,
  };
}

/** The build's saved assumptions, or the defaults (isDefault) when the owner has saved none. */
export async function getAssumptions(knex: Knex, buildId: string): Promise<AssumptionsResponse> {
  const row = await repo.findAssumptions(knex, buildId);
  return row
    ? { assumptions: fromStored(row), isDefault: false }
    : { assumptions: defaults(), isDefault: true };
}

/** Replaces the build's assumptions (fields left out of the body took their defaults). */
export async function saveAssumptions(
  knex: Knex,
  buildId: string,
  input: Assumptions,
): Promise<AssumptionsResponse> {
  await repo.upsertAssumptions(knex, buildId, toStored(input));
  return getAssumptions(knex, buildId);
}

/** POST /api/estimate: the body is already parsed by estimateRequestSchema. */
export function estimateStateless(input: EstimateInput): EstimateResult {
  return estimate(input);
}

/**
 * A stored build's estimate: its target and cylinders, its saved assumptions
 * (or the defaults) and its rated parts that have not been sent back.
 */
export async function estimateBuild(knex: Knex, buildId: string): Promise<EstimateResult> {
  const [target, saved, components] = await Promise.all([
    repo.findBuildTarget(knex, buildId),
    getAssumptions(knex, buildId),
    repo.listRatedParts(knex, buildId),
  ]);
  if (!target) throw new NotFoundError('Build not found');
  return estimate({
    target: { powerHp: target.powerHp, basis: target.basis, torqueLbft: target.torqueLbft },
    assumptions: { ...saved.assumptions, cylinders: target.cylinders },
    components,
  });
}
