import type { Knex } from 'knex';
import { buildToday, fallbackTimeZone } from '@shared/dates';
import { can, type Role } from '@shared/permissions';
import type { CreateBuildInput, UpdateBuildInput } from '@shared/schemas/builds';
import { stripMoney } from '@server/lib/money-filter';
import { NotFoundError } from '@server/lib/errors';
import type { BuildRowJson } from '@server/lib/sessions.repository';
import type { Logger } from '@server/lib/logger';
import type { Storage } from '@server/lib/storage';
import * as files from '@server/features/files';
import * as members from '@server/features/members';
import * as repo from './builds.repository';

/** My builds, each shown as my role on it allows (money only where I own it). */
export async function listMine(knex: Knex, userId: string) {
  const builds = await repo.listBuildsForUser(knex, userId);
  return builds.map((b) => (can(b.myRole, 'money:read') ? b : stripMoney(b)));
}

/**
 * The build's calendar now: its time zone (UTC until chosen) and its today there, the one
 * "today" every service stamps and judges a build's dates by (shared/dates buildToday).
 * `known` is the build's row when the access check already holds it.
 */
export async function calendar(
  knex: Knex,
  buildId: string,
  now: Date = new Date(),
  known?: BuildRowJson,
) {
  // The row the session brought holds the zone: no statement of its own then.
  const chosen = known
    ? ((known.time_zone as string | null | undefined) ?? null)
    : await repo.findTimeZone(knex, buildId);
  return {
    timeZone: chosen ?? fallbackTimeZone,
    today: buildToday({ timeZone: chosen }, now),
  };
}

/** What the access check may already hold: the caller's role and the build's row (lib/request.ts). */
export type KnownBuild = { role: Role; build?: BuildRowJson };

/** The build as `userId` sees it; read from `known` when the session brought its row. */
export async function get(knex: Knex, buildId: string, userId: string, known?: KnownBuild) {
  if (known?.build) return repo.buildFromJson(known.build, known.role);
  const build = await repo.findBuildForUser(knex, buildId, userId);
  if (!build) throw new NotFoundError('Build not found');
  return build;
}

/** The build and its first owner are written together or not at all. */
export async function create(knex: Knex, userId: string, input: CreateBuildInput) {
  const id = await knex.transaction(async (trx) => {
    const buildId = await repo.insertBuild(trx, input);
    await members.addMember(trx, buildId, userId, 'owner');
    return buildId;
  });
  return get(knex, id, userId);
}

export async function update(knex: Knex, buildId: string, userId: string, input: UpdateBuildInput) {
  await repo.updateBuild(knex, buildId, input);
  return get(knex, buildId, userId);
}

/** The build and its rows by cascade; their files are queued with them and removed after. */
export async function remove(
  knex: Knex,
  buildId: string,
  ctx: { storage: Storage; logger: Logger },
) {
  await repo.deleteBuild(knex, buildId);
  await files.purgeSoon({ knex, ...ctx });
}
