/** The budget: planned, committed and spent against the build's budget, per category. */
import type { Knex } from 'knex';
import { computeBudget } from '../../../shared/ledger/budget';
import { NotFoundError } from '../../lib/errors';
import * as builds from '../builds';
import * as parts from '../parts';

export async function get(knex: Knex, buildId: string, userId: string) {
  const build = await builds.get(knex, buildId, userId).catch(() => undefined);
  if (!build) throw new NotFoundError('Build not found');
  const all = await parts.listAll(knex, buildId);
  return computeBudget(all, build.budgetCents ?? 0, build.currency);
}
