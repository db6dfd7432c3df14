import { describe, expect, it } from 'vitest';
import { useTestApp } from '../helpers/app';
import { buildWithCast } from '../helpers/factories';

const app = useTestApp();

type Summary = { id: string; position: number; steps: { id: string; position: number }[] };

/** Round-robin: one request of each kind after another, so every kind overlaps every other. */
function interleave<T>(...lists: T[][]): T[] {
  const out: T[] = [];
  for (let i = 0; i < Math.max(...lists.map((l) => l.length)); i++) {
    for (const l of lists) if (i < l.length) out.push(l[i]);
  }
  return out;
}

const oneToN = (n: number) => Array.from({ length: n }, (_, i) => i + 1);

describe('install log under concurrent writes', () => {
  it('adds, moves and deletes steps and jobs of one build at once without a server error, and keeps every position 1..n', async () => {
    const { owner, crew, build } = await buildWithCast(app);
    const base = `/api/builds/${build.id}`;
    const jobs: { id: string }[] = [];
    for (const title of ['Fuel', 'Exhaust', 'Cooling', 'Scrap job']) {
      jobs.push((await owner.agent.post(`${base}/jobs`).send({ title }).expect(201)).body.job);
    }
    const [fuel, exhaust, , scrap] = jobs;
    const steps: { id: string }[] = [];
    for (let i = 1; i <= 8; i++) {
      const jobId = i <= 6 ? fuel.id : exhaust.id;
      steps.push(
        (
          await crew.agent
            .post(`${base}/jobs/${jobId}/steps`)
            .send({ title: `Step ${i}` })
            .expect(201)
        ).body.step,
      );
    }
    // Steps 1–4 of Fuel are moved, 5–6 deleted; steps 7–8 of Exhaust are moved.
    const moved = [steps[0], steps[1], steps[2], steps[3], steps[6], steps[7]];

    const requests = interleave(
      oneToN(16).map((i) =>
        crew.agent
          .post(`${base}/jobs/${i % 4 === 0 ? exhaust.id : fuel.id}/steps`)
          .send({ title: `Added ${i}`, position: (i % 5) + 1 }),
      ),
      oneToN(10).map((i) =>
        owner.agent
          .patch(`${base}/steps/${moved[i % moved.length].id}`)
          .send({ position: (i % 7) + 1 }),
      ),
      oneToN(6).map((i) =>
        owner.agent.patch(`${base}/jobs/${jobs[i % 3].id}`).send({ position: (i % 4) + 1 }),
      ),
      oneToN(4).map((i) => owner.agent.post(`${base}/jobs`).send({ title: `New job ${i}` })),
      [
        owner.agent.delete(`${base}/steps/${steps[4].id}`),
        owner.agent.delete(`${base}/steps/${steps[5].id}`),
        owner.agent.delete(`${base}/jobs/${scrap.id}`),
      ],
    );
    const answers = await Promise.all(requests);

    const failed = answers.filter((r) => r.status >= 300).map((r) => [r.status, r.body]);
    expect(failed).toEqual([]);

    const added = answers.filter((r) => r.body?.step?.title?.startsWith('Added'));
    expect(added).toHaveLength(16);
    const listed: Summary[] = (await owner.agent.get(`${base}/jobs`).expect(200)).body.jobs;
    expect(listed.map((j) => j.position)).toEqual(oneToN(3 + 4));
    for (const job of listed)
      expect(job.steps.map((s) => s.position)).toEqual(oneToN(job.steps.length));
    const stepIds = listed.flatMap((j) => j.steps.map((s) => s.id));
    expect(new Set(stepIds).size).toBe(stepIds.length);
    expect(stepIds.sort()).toEqual(
      [...moved.map((s) => s.id), ...added.map((r) => r.body.step.id)].sort(),
    );
    // The database holds no duplicate either (the list orders by position, then creation).
    const dupes = await app.db
      .knex('install_steps')
      .where({ build_id: build.id })
      .groupBy('job_id', 'position')
      .havingRaw('count(*) > 1')
      .select('job_id', 'position');
    expect(dupes).toEqual([]);
  });
});
