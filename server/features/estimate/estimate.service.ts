import type { Knex } from 'knex';
import { estimate } from '@shared/estimate';
import {
  assumptionsInputSchema,
  type Assumptions,
  type AssumptionsResponse,
  type EstimateComponent,
  type EstimateInput,
  type EstimateResult,
} from '@shared/schemas/estimate';
import { convertBsfc } from '@shared/units/convert';
import { partCategoryLabels } from '@shared/schemas/parts';
import { ConflictError, NotFoundError } from '@server/lib/errors';
import type { BuildRowJson } from '@server/lib/sessions.repository';
import * as repo from './estimate.repository';

/** The default assumptions, as the schema fills them in for an empty body (parsed once). */
const defaultAssumptions = assumptionsInputSchema.parse({});
function defaults(): Assumptions {
  return { ...defaultAssumptions };
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
  return assumptionsFrom(await repo.findAssumptions(knex, buildId));
}

function assumptionsFrom(row: repo.StoredAssumptions | undefined): AssumptionsResponse {
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
 * A shop sees only the parts sent to it (product.md). It still reads the
 * build's estimate — the limits its work must fit — but every other part is
 * anonymised before the computation, so no name or id of it reaches the
 * shop, in the figures or in the warnings' words.
 */
export function anonymiseForShop(parts: repo.RatedPart[], shopUserId: string): EstimateComponent[] {
  const seen = new Map<string, number>();
  return parts.map(({ shopUserId: sentTo, ...part }) => {
    if (sentTo === shopUserId) return part;
    const n = (seen.get(part.category) ?? 0) + 1;
    seen.set(part.category, n);
    const label = partCategoryLabels[part.category].toLowerCase();
    return {
      ...part,
      id: `other-${part.category}-${n}`,
      name: `Another part (${label}${n > 1 ? ` ${n}` : ''})`,
      ratingFor: undefined,
      anonymised: true,
    };
  });
}

/**
 * A stored build's estimate: its target and cylinders, its saved assumptions
 * (or the defaults) and its rated parts that have not been sent back.
 * viewer.shopUserId set: the caller is a shop member (see anonymiseForShop).
 * buildRow: the build's row when the session brought it (no statement for the target).
 */
export async function estimateBuild(
  knex: Knex,
  buildId: string,
  viewer: { shopUserId?: string } = {},
  buildRow?: BuildRowJson,
): Promise<EstimateResult> {
  const [target, inputs] = await Promise.all([
    buildRow ? repo.targetOf(buildRow) : repo.findBuildTarget(knex, buildId),
    repo.findEstimateInputs(knex, buildId),
  ]);
  const saved = assumptionsFrom(inputs.assumptions);
  const parts = inputs.parts;
  if (!target) throw new NotFoundError('Build not found');
  // Targets are refused below 0.1 hp on the way in; a row stored before that rule may still
  // hold 0, from which nothing can be worked out. Say so instead of failing.
  if (!(target.powerHp > 0)) {
    throw new ConflictError(
      'no_target',
      `This build's target power is stored as ${target.powerHp} hp, so there is nothing to estimate. Set a target above zero on the build's edit page.`,
    );
  }
  const components = viewer.shopUserId
    ? anonymiseForShop(parts, viewer.shopUserId)
    : parts.map(({ shopUserId: _sentTo, ...part }) => part);
  return estimate(
    {
      target: { powerHp: target.powerHp, basis: target.basis, torqueLbft: target.torqueLbft },
      assumptions: { ...saved.assumptions, cylinders: target.cylinders },
      components,
    },
    { cylindersFrom: 'build' },
  );
}
