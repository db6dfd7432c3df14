/** The budget: planned, committed and spent against the build's budget, per category. */
import type { Knex } from 'knex';
import { computeBudget } from '@shared/ledger/budget';
import { NotFoundError } from '@server/lib/errors';
import * as builds from '@server/features/builds';
import * as parts from '@server/features/parts';

export async function get(knex: Knex, buildId: string, userId: string, known?: builds.KnownBuild) {
  const [build, all] = await Promise.all([
    builds.get(knex, buildId, userId, known).catch(() => undefined),
    parts.listMoney(knex, buildId),
  ]);
  if (!build) throw new NotFoundError('Build not found');
  return computeBudget(all, build.budgetCents ?? 0, build.currency);
}
