import type { Knex } from 'knex';
import type { Role } from '@shared/permissions';
import type { Build, CreateBuildInput, UpdateBuildInput } from '@shared/schemas/builds';
import type { BuildRowJson } from '@server/lib/sessions.repository';

/** camelCase field → snake_case column, for every field an owner can write. */
const columns = {
  name: 'name',
  vehicleYear: 'vehicle_year',
  vehicleDescription: 'vehicle_description',
  engineDescription: 'engine_description',
  displacementLiters: 'displacement_liters',
  cylinders: 'cylinders',
  aspiration: 'aspiration',
  transmission: 'transmission',
  stockPowerHp: 'stock_power_hp',
  stockPowerBasis: 'stock_power_basis',
  targetPowerHp: 'target_power_hp',
  targetPowerBasis: 'target_power_basis',
  targetTorqueLbft: 'target_torque_lbft',
  targetDate: 'target_date',
  targetEvent: 'target_event',
  budgetCents: 'budget_cents',
  currency: 'currency',
  timeZone: 'time_zone',
  wrenchCalibrationMonths: 'wrench_calibration_months',
} as const satisfies Record<keyof CreateBuildInput, string>;

type Row = Record<string, unknown> & {
  id: string;
  role: Role;
  member_count: number;
  created_at: Date;
  updated_at: Date;
};

function toRow(input: UpdateBuildInput) {
  const row: Record<string, unknown> = {};
  for (const [key, column] of Object.entries(columns)) {
    const value = input[key as keyof UpdateBuildInput];
    if (value !== undefined) row[column] = value;
  }
  return row;
}

function toBuild(row: Row): Build {
  const build: Record<string, unknown> = {
    id: row.id,
    myRole: row.role,
    memberCount: row.member_count,
    createdAt: row.created_at.toISOString(),
    updatedAt: row.updated_at.toISOString(),
  };
  for (const [key, column] of Object.entries(columns)) build[key] = row[column];
  return build as Build;
}

function selectForUser(knex: Knex, userId: string) {
  return knex('builds as b')
    .join('build_members as me', function () {
      this.on('me.build_id', 'b.id').andOnVal('me.user_id', userId);
    })
    .select(
      'b.*',
      'me.role',
      knex.raw(
        '(select count(*)::int from build_members m where m.build_id = b.id) as member_count',
      ),
    );
}

export async function listBuildsForUser(knex: Knex, userId: string) {
  const rows: Row[] = await selectForUser(knex, userId).orderBy('b.updated_at', 'desc');
  return rows.map(toBuild);
}

export async function findBuildForUser(knex: Knex, buildId: string, userId: string) {
  const row: Row | undefined = await selectForUser(knex, userId).where('b.id', buildId).first();
  return row ? toBuild(row) : undefined;
}

/**
 * The build from the row that came with the session (to_jsonb of the builds row,
 * timestamps as text), exactly as findBuildForUser gives it, without a statement.
 */
export function buildFromJson(json: BuildRowJson, role: Role): Build {
  return toBuild({
    ...json,
    role,
    created_at: new Date(json.created_at as string),
    updated_at: new Date(json.updated_at as string),
  });
}

/** The build's IANA time zone, or null until its owner chooses one (or no such build). */
export async function findTimeZone(knex: Knex, buildId: string): Promise<string | null> {
  const row = await knex('builds').where({ id: buildId }).first('time_zone');
  return row?.time_zone ?? null;
}

export async function insertBuild(knex: Knex, input: CreateBuildInput): Promise<string> {
  const [row] = await knex('builds').insert(toRow(input)).returning('id');
  return row.id;
}

export async function updateBuild(knex: Knex, buildId: string, input: UpdateBuildInput) {
  await knex('builds')
    .where({ id: buildId })
    .update({ ...toRow(input), updated_at: knex.fn.now() });
}

export async function deleteBuild(knex: Knex, buildId: string) {
  await knex('builds').where({ id: buildId }).delete();
}
