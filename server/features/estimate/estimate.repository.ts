import type { Knex } from 'knex';
import type { powerBases } from '@shared/schemas/builds';
import type { EstimateComponent } from '@shared/schemas/estimate';
import type { BsfcUnit } from '@shared/units/convert';
import type { PartCategory, RatingUnit } from '@shared/schemas/parts';

/** The build fields the estimate starts from. */
export type BuildTarget = {
  powerHp: number;
  basis: (typeof powerBases)[number];
  torqueLbft: number | null;
  cylinders: number;
};

/** A saved assumptions row, BSFC in lb/(hp·h) plus the unit the owner typed it in. */
export type StoredAssumptions = {
  bsfcLbPerHpH: number;
  bsfcEntryUnit: BsfcUnit;
  afr: number;
  fuelDensityKgPerL: number;
  drivetrainLossPct: number;
  peakRpm: number;
  tightMarginPct: number;
};

/** The target from a builds row: one read here, or the row that came with the session. */
export function targetOf(row: Record<string, unknown>): BuildTarget {
  return {
    powerHp: row.target_power_hp as number,
    basis: row.target_power_basis as BuildTarget['basis'],
    torqueLbft: row.target_torque_lbft as number | null,
    cylinders: row.cylinders as number,
  };
}

export async function findBuildTarget(
  knex: Knex,
  buildId: string,
): Promise<BuildTarget | undefined> {
  const row: Record<string, unknown> | undefined = await knex('builds')
    .where({ id: buildId })
    .first('target_power_hp', 'target_power_basis', 'target_torque_lbft', 'cylinders');
  return row && targetOf(row);
}

type AssumptionsRow = Record<string, unknown> & { bsfc_entry_unit: BsfcUnit };

function toStoredAssumptions(row: AssumptionsRow): StoredAssumptions {
  return {
    bsfcLbPerHpH: row.bsfc_lb_per_hp_h as number,
    bsfcEntryUnit: row.bsfc_entry_unit,
    afr: row.afr as number,
    fuelDensityKgPerL: row.fuel_density_kg_per_l as number,
    drivetrainLossPct: row.drivetrain_loss_pct as number,
    peakRpm: row.peak_rpm as number,
    tightMarginPct: row.tight_margin_pct as number,
  };
}

export async function findAssumptions(
  knex: Knex,
  buildId: string,
): Promise<StoredAssumptions | undefined> {
  const row: AssumptionsRow | undefined = await knex('build_assumptions')
    .where({ build_id: buildId })
    .first();
  return row && toStoredAssumptions(row);
}

/** Inserts or replaces the build's one row. */
export async function upsertAssumptions(knex: Knex, buildId: string, a: StoredAssumptions) {
  const values = {
    bsfc_lb_per_hp_h: a.bsfcLbPerHpH,
    bsfc_entry_unit: a.bsfcEntryUnit,
    afr: a.afr,
    fuel_density_kg_per_l: a.fuelDensityKgPerL,
    drivetrain_loss_pct: a.drivetrainLossPct,
    peak_rpm: a.peakRpm,
    tight_margin_pct: a.tightMarginPct,
  };
  await knex('build_assumptions')
    .insert({ build_id: buildId, ...values })
    .onConflict('build_id')
    .merge({ ...values, updated_at: knex.fn.now() });
}

/** The build's parts that carry a rating and have not been sent back, as estimator components. */
export type RatedPart = EstimateComponent & { shopUserId: string | null };

type RatedPartRow = {
  id: string;
  name: string;
  category: PartCategory;
  quantity: number;
  rating_value: number;
  rating_unit: RatingUnit;
  rating_for: string;
  shop_user_id: string | null;
};

function toRatedPart(r: RatedPartRow): RatedPart {
  return {
    id: r.id,
    name: r.name,
    category: r.category,
    quantity: r.quantity,
    ratingValue: r.rating_value,
    ratingUnit: r.rating_unit,
    ...(r.rating_for ? { ratingFor: r.rating_for } : {}),
    shopUserId: r.shop_user_id,
  };
}

/**
 * What a build's estimate reads besides the build, in one statement: the saved
 * assumptions (if any) and the parts that carry a rating and have not been sent
 * back, ordered by category, name and id. A named statement (planned once per
 * connection): its two columns are jsonb whatever the tables gain, so a migration
 * adding a column cannot change its result type.
 */
export async function findEstimateInputs(
  knex: Knex,
  buildId: string,
): Promise<{ assumptions: StoredAssumptions | undefined; parts: RatedPart[] }> {
  const { rows } = await knex
    .raw<{
      rows: { assumptions: AssumptionsRow | null; parts: RatedPartRow[] }[];
    }>(
      `select
       (select to_jsonb(a) from build_assumptions a where a.build_id = :buildId) as assumptions,
       coalesce((
         select jsonb_agg(jsonb_build_object(
             'id', p.id, 'name', p.name, 'category', p.category, 'quantity', p.quantity,
             'rating_value', p.rating_value, 'rating_unit', p.rating_unit,
             'rating_for', p.rating_for, 'shop_user_id', p.shop_user_id)
           order by p.category, p.name, p.id)
         from parts p
         where p.build_id = :buildId and p.status <> 'returned'
           and p.rating_value is not null and p.rating_unit is not null
       ), '[]') as parts`,
      { buildId },
    )
    .options({ name: 'estimate-inputs' });
  const row = rows[0];
  return {
    assumptions: row.assumptions ? toStoredAssumptions(row.assumptions) : undefined,
    parts: row.parts.map(toRatedPart),
  };
}
