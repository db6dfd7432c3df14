/**
 * How many SQL statements each common GET costs, counted deterministically from
 * knex's and pg's own query events (not timed). A budget per request, the same
 * for a build with 5 parts as with 150 — a list that grows with the build is an
 * N+1 and fails here. The session library's occasional session-extension write
 * is the one allowed extra.
 */
import { describe, expect, it } from 'vitest';
import { useTestApp, type TestApp } from '../helpers/app';
import { buildWithCast } from '../helpers/factories';

const app = useTestApp();

/** Counts every statement the app sends while `f` runs: knex's and the session pool's. */
async function countQueries(t: TestApp, f: () => Promise<unknown>) {
  let n = 0;
  const onKnex = () => n++;
  t.db.knex.on('query', onKnex);
  const pool = t.db.pool as unknown as { query: (...a: unknown[]) => unknown };
  const original = pool.query;
  pool.query = function (this: unknown, ...args: unknown[]) {
    n++;
    return original.apply(this, args);
  };
  try {
    await f();
  } finally {
    t.db.knex.removeListener('query', onKnex);
    pool.query = original;
  }
  return n;
}

// At most 4 each (the ceiling); held at what they cost now, so a statement added to
// one of these reads shows here: the session lookup brings the build's row (build: 1), the
// estimate's assumptions and rated parts are one statement, the jobs list reads jobs with their
// steps in one and the specs with their current readings in another.
const budget = { health: 1, build: 1, estimate: 2, budget: 2, parts: 2, jobs: 3 };

async function buildOfSize(parts: number, steps: number) {
  const cast = await buildWithCast(app);
  const base = `/api/builds/${cast.build.id}`;
  const ids: string[] = [];
  for (let i = 0; i < parts; i++) {
    const res = await cast.owner.agent.post(`${base}/parts`).send({
      category: i % 3 === 0 ? 'fuel-injection' : 'bottom-end',
      name: `Part ${i}`,
      ratingValue: 700 + i,
      ratingUnit: 'hp-crank',
    });
    ids.push(res.body.part.id);
  }
  const job = (await cast.crew.agent.post(`${base}/jobs`).send({ title: 'Job' })).body.job;
  for (let i = 0; i < steps; i++) {
    const step = (
      await cast.crew.agent
        .post(`${base}/jobs/${job.id}/steps`)
        .send({ title: `Step ${i}`, partIds: [ids[i % ids.length]] })
    ).body.step;
    await cast.crew.agent.post(`${base}/steps/${step.id}/checklist`).send({ label: 'Clean' });
    const spec = (
      await cast.crew.agent.post(`${base}/steps/${step.id}/fasteners`).send({
        name: 'Bolts',
        count: 2,
        targetValue: 100,
        targetUnit: 'lbf-ft',
        toleranceType: 'percent',
        toleranceValue: 5,
        threadCondition: 'oiled',
        specSource: 'Service manual',
      })
    ).body.fastener;
    await cast.crew.agent
      .post(`${base}/fasteners/${spec.id}/readings`)
      .send({ position: 1, value: 101, unit: 'lbf-ft' });
  }
  return { ...cast, base };
}

async function counts(size: Awaited<ReturnType<typeof buildOfSize>>) {
  const { owner, base } = size;
  // Warm the session first: its first use may extend it (the allowed extra write).
  await owner.agent.get('/api/me');
  const get = (url: string) => async () => {
    const res = await owner.agent.get(url);
    expect(res.status, url).toBe(200);
  };
  return {
    health: await countQueries(app, get('/api/health')),
    build: await countQueries(app, get(base)),
    estimate: await countQueries(app, get(`${base}/estimate`)),
    budget: await countQueries(app, get(`${base}/budget`)),
    parts: await countQueries(app, get(`${base}/parts`)),
    jobs: await countQueries(app, get(`${base}/jobs`)),
  };
}

describe('SQL statements per request', () => {
  it('stay within budget, and the same for 5 parts as for 150', { timeout: 120_000 }, async () => {
    const small = await counts(await buildOfSize(5, 2));
    const large = await counts(await buildOfSize(150, 20));
    expect(large).toEqual(small);
    for (const [name, n] of Object.entries(small)) {
      expect(n, name).toBeLessThanOrEqual(budget[name as keyof typeof budget]);
    }
  });
});
