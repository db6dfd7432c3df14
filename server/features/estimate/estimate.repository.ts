import type { Knex } from 'knex';
import type { powerBases } from '../../../shared/schemas/builds';
import type { EstimateComponent } from '../../../shared/schemas/estimate';
import type { BsfcUnit } from '../../../shared/units/convert';
import type { PartCategory, RatingUnit } from '../../../shared/schemas/parts';

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

export async function findAssumptions(
  knex: Knex,
  buildId: string,
): Promise<StoredAssumptions | undefined> {
  const row = await knex('build_assumptions').where({ build_id: buildId }).first();
  if (!row) return undefined;
  return {
    bsfcLbPerHpH: row.bsfc_lb_per_hp_h,
    bsfcEntryUnit: row.bsfc_entry_unit,
    afr: row.afr,
    fuelDensityKgPerL: row.fuel_density_kg_per_l,
    drivetrainLossPct: row.drivetrain_loss_pct,
    peakRpm: row.peak_rpm,
    tightMarginPct: row.tight_margin_pct,
  };
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

export async function listRatedParts(knex: Knex, buildId: string): Promise<RatedPart[]> {
  const rows: {
    id: string;
    name: string;
    category: PartCategory;
    quantity: number;
    rating_value: number;
    rating_unit: RatingUnit;
    rating_for: string;
    shop_user_id: string | null;
  }[] = await knex('parts')
    .where({ build_id: buildId })
    .whereNot({ status: 'returned' })
    .whereNotNull('rating_value')
    .whereNotNull('rating_unit')
    .orderBy([{ column: 'category' }, { column: 'name' }, { column: 'id' }])
    .select(
      'id',
      'name',
      'category',
      'quantity',
      'rating_value',
      'rating_unit',
      'rating_for',
      'shop_user_id',
    );
  return rows.map((r) => ({
    id: r.id,
    name: r.name,
    category: r.category,
    quantity: r.quantity,
    ratingValue: r.rating_value,
    ratingUnit: r.rating_unit,
    ...(r.rating_for ? { ratingFor: r.rating_for } : {}),
    shopUserId: r.shop_user_id,
  }));
}
