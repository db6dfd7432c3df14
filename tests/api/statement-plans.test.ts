/**
 * The named statements of the common reads are planned once per connection: after a few
 * executions PostgreSQL keeps a generic plan instead of planning the text again each time.
 * A text whose best plan depends on a parameter (`$1 is null or exists (…)`) is planned
 * afresh on every run — the jobs list's did, and it cost half that list's database time.
 * Read from pg_prepared_statements (PostgreSQL 14+), so deterministic, not timed. (With a
 * skewed table PostgreSQL may still re-plan a one-table statement for its parameter, as
 * the budget's may; that costs little. Joins are what it must not re-plan.)
 */
import knexFactory, { type Knex } from 'knex';
import pg from 'pg';
import { afterAll, describe, expect, it } from 'vitest';
import { listParts } from '@server/features/parts/parts.repository';
import { listPartMoney } from '@server/features/parts/parts-money.repository';
import { listJobsWithSteps } from '@server/features/install-log/jobs.repository';
import { listSpecsWithCurrentReadings } from '@server/features/install-log/fasteners.repository';
import { findEstimateInputs } from '@server/features/estimate/estimate.repository';
import { findSession } from '@server/lib/sessions.repository';
import { useTestApp } from '../helpers/app';
import { buildWithCast } from '../helpers/factories';

// Its own database: whether PostgreSQL keeps a generic plan also depends on the statistics,
// and a build of 150 parts in a shared database would tilt them. The guard is about the
// texts: one that can only be planned for its parameters never gets a generic plan.
const app = useTestApp({}, { ownDatabase: true });
const opened: { close: () => Promise<void> }[] = [];
afterAll(async () => {
  for (const o of opened) await o.close();
});

/** A knex and a pg pool of one connection each, so every run lands on the same session. */
function oneConnection() {
  const config = app.db.knex.client.config as Knex.Config;
  const knex = knexFactory({ ...config, pool: { min: 1, max: 1 } });
  const conn = config.connection as string | { connectionString: string };
  const pool = new pg.Pool({
    connectionString: typeof conn === 'string' ? conn : conn.connectionString,
    max: 1,
  });
  opened.push({ close: () => knex.destroy() }, { close: () => pool.end() });
  return { knex, pool };
}

async function plans(run: { query: (sql: string) => Promise<{ rows: unknown[] }> }) {
  const { rows } = await run.query(
    'select name, generic_plans::int, custom_plans::int from pg_prepared_statements',
  );
  return Object.fromEntries(
    (rows as { name: string; generic_plans: number; custom_plans: number }[]).map((r) => [
      r.name,
      { generic: r.generic_plans, custom: r.custom_plans },
    ]),
  );
}

describe('named statements of the common reads', () => {
  it('are planned once, not on every request', { timeout: 60_000 }, async () => {
    const cast = await buildWithCast(app);
    const base = `/api/builds/${cast.build.id}`;
    const part = (
      await cast.owner.agent.post(`${base}/parts`).send({
        category: 'fuel-injection',
        name: 'Injector set',
        ratingValue: 700,
        ratingUnit: 'hp-crank',
        status: 'at-shop',
        shopUserId: cast.shop.id,
      })
    ).body.part;
    expect(part?.id).toBeTruthy();
    const job = (await cast.crew.agent.post(`${base}/jobs`).send({ title: 'Job' })).body.job;
    const step = (
      await cast.crew.agent
        .post(`${base}/jobs/${job.id}/steps`)
        .send({ title: 'Step', partIds: [part.id] })
    ).body.step;
    await cast.crew.agent.post(`${base}/steps/${step.id}/checklist`).send({ label: 'Clean' });

    const sessionId = (await app.db.knex('user_sessions').where({ user_id: cast.owner.id }).first())
      .id as string;
    const { knex, pool } = oneConnection();
    for (let i = 0; i < 10; i++) {
      await findSession(pool, sessionId, cast.build.id);
      await listParts(knex, cast.build.id);
      await listParts(knex, cast.build.id, { shopUserId: cast.shop.id });
      await listJobsWithSteps(knex, cast.build.id, null);
      await listJobsWithSteps(knex, cast.build.id, cast.shop.id);
      await listSpecsWithCurrentReadings(knex, cast.build.id);
      await findEstimateInputs(knex, cast.build.id);
      await listPartMoney(knex, cast.build.id);
    }
    const seen = { ...(await plans(pool)), ...(await plans({ query: (sql) => knex.raw(sql) })) };
    const names = [
      'session-with-build',
      'parts-list',
      'parts-money',
      'jobs-with-steps',
      'jobs-with-shop-steps',
      'specs-with-current-readings',
      'estimate-inputs',
    ];
    expect(Object.keys(seen).sort()).toEqual([...names].sort());
    // PostgreSQL plans the first five runs for their parameters, then keeps the generic plan
    // when it costs no more (plancache.c); a statement it re-plans every time never gets one.
    for (const name of names) {
      expect(seen[name].generic + seen[name].custom, name).toBe(name === 'parts-list' ? 20 : 10);
      expect(seen[name].generic, name).toBeGreaterThan(0);
    }
  });
});
