/**
 * What the crew, the owner and a shop tripped on in the install log (issue 20): an override
 * sign-off that listed like a clean one, a shop's steps numbered "3 of 2", readings without
 * their stage or cylinder, the wrench as free text, and cautions matched on words alone.
 */
import { describe, expect, it } from 'vitest';
import { useTestApp, type Agent } from '../helpers/app';
import { buildWithCast } from '../helpers/factories';

const app = useTestApp();

const spec = {
  name: 'Injector hold-down bolts',
  count: 2,
  targetValue: 100,
  targetUnit: 'lbf-ft',
  toleranceType: 'percent',
  toleranceValue: 5,
  stages: [40, 80],
  threadCondition: 'oiled',
  specSource: "Maker's service manual, fuel system section (test entry)",
};

async function setUp() {
  const cast = await buildWithCast(app);
  const base = `/api/builds/${cast.build.id}`;
  const job = (await cast.owner.agent.post(`${base}/jobs`).send({ title: 'Injectors' })).body.job;
  const step = async (body: Record<string, unknown>, agent: Agent = cast.crew.agent) => {
    const res = await agent.post(`${base}/jobs/${job.id}/steps`).send(body);
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    return res.body.step;
  };
  return { ...cast, base, job, step };
}

const monthsAgo = (n: number) => {
  const d = new Date();
  d.setUTCDate(1);
  d.setUTCMonth(d.getUTCMonth() - n);
  return d.toISOString().slice(0, 10);
};

describe('the jobs list', () => {
  it('tells a sign-off over open items from a clean one, with the reason and who', async () => {
    const c = await setUp();
    const open = await c.step({ title: 'Seat the injectors' });
    await c.crew.agent.post(`${c.base}/steps/${open.id}/fasteners`).send(spec).expect(201);
    const clean = await c.step({ title: 'Wipe the bores' });
    await c.owner.agent
      .post(`${c.base}/steps/${open.id}/sign-off`)
      .send({ overrideReason: 'Readings are on the paper sheet in the truck' })
      .expect(200);
    await c.crew.agent.post(`${c.base}/steps/${clean.id}/sign-off`).send({}).expect(200);

    const [job] = (await c.viewer.agent.get(`${c.base}/jobs`)).body.jobs;
    const [a, b] = job.steps;
    expect(a.signOff).toMatchObject({
      by: { id: c.owner.id, name: c.owner.displayName },
      override: {
        reason: 'Readings are on the paper sheet in the truck',
        blockers: [{ kind: 'missing-readings' }],
      },
    });
    expect(b.signOff).toMatchObject({ by: { id: c.crew.id }, override: null });
    expect(b.signedOffAt).toBe(b.signOff.at);
  });

  it('numbers a shop’s steps as the shop sees them, in the list, the job and the step', async () => {
    const c = await setUp();
    const part = (
      await c.owner.agent.post(`${c.base}/parts`).send({
        category: 'fuel-injection',
        name: 'Injector set',
        status: 'at-shop',
        shopUserId: c.shop.id,
        sentOutOn: '2026-01-05',
      })
    ).body.part;
    await c.step({ title: 'Pull the valve covers' });
    await c.step({ title: 'Remove the old injectors' });
    const third = await c.step({ title: 'Seat the rebuilt injectors', partIds: [part.id] });
    expect(third.position).toBe(3);

    const [job] = (await c.shop.agent.get(`${c.base}/jobs`)).body.jobs;
    expect(
      job.steps.map((s: { title: string; position: number }) => [s.title, s.position]),
    ).toEqual([['Seat the rebuilt injectors', 1]]);
    const one = (await c.shop.agent.get(`${c.base}/jobs/${c.job.id}`)).body.job;
    expect(one.steps[0].position).toBe(1);
    expect((await c.shop.agent.get(`${c.base}/steps/${third.id}`)).body.step.position).toBe(1);
    // Everyone else still sees its place in the whole job.
    expect((await c.crew.agent.get(`${c.base}/steps/${third.id}`)).body.step.position).toBe(3);
  });
});

describe('readings name their stage, and positions their names', () => {
  it('records each stage apart from the final torque, judged against the stage', async () => {
    const c = await setUp();
    const s = await c.step({ title: 'Torque the hold-downs' });
    const f = (await c.crew.agent.post(`${c.base}/steps/${s.id}/fasteners`).send(spec)).body
      .fastener;
    const read = (body: Record<string, unknown>) =>
      c.crew.agent.post(`${c.base}/fasteners/${f.id}/readings`).send(body);

    const stage1 = await read({ position: 1, value: 41, unit: 'lbf-ft', stage: 1 });
    expect(stage1.status, JSON.stringify(stage1.body)).toBe(201);
    // 40 lbf·ft ± 5 % is 38–42: 41 is in spec for stage 1 (it would be far under the final 100).
    expect(stage1.body.reading).toMatchObject({ stage: 1, verdict: 'in-spec' });
    const over = await read({ position: 2, value: 50, unit: 'lbf-ft', stage: 1 });
    expect(over.body.reading).toMatchObject({ stage: 1, verdict: 'over' });
    await read({ position: 1, value: 80, unit: 'lbf-ft', stage: 2 }).expect(201);
    const redo = await read({ position: 2, value: 40, unit: 'lbf-ft', stage: 1 });
    expect(redo.body.supersededId).toBe(over.body.reading.id);

    const positions = redo.body.fastener.positions;
    expect(positions[0].stages.map((r: { value: number } | null) => r?.value)).toEqual([41, 80]);
    expect(positions[1].stages.map((r: { value: number } | null) => r?.value ?? null)).toEqual([
      40,
      null,
    ]);
    // Stages are on the way to the final torque: nothing counts as torqued yet.
    expect(positions[0].current).toBeNull();
    const [job] = (await c.crew.agent.get(`${c.base}/jobs`)).body.jobs;
    expect(job.steps[0].progress).toMatchObject({ positionsRecorded: 0, outOfSpec: 0 });
    const final = await read({ position: 1, value: 101, unit: 'lbf-ft' });
    expect(final.body.supersededId).toBeNull();
    expect(final.body.fastener.positions[0].stages[0].value).toBe(41);
    // Only the final and re-check readings send out-of-spec notices.
    const notices = () =>
      app.db
        .knex('mail_outbox')
        .where({ kind: 'notice:torque-out-of-spec' })
        .whereLike('action_path', `/builds/${c.build.id}/%`);
    expect(await notices()).toEqual([]);
    await read({ position: 2, value: 120, unit: 'lbf-ft' }).expect(201);
    expect((await notices()).length).toBeGreaterThan(0);
  });

  it('refuses a stage the spec does not have, and a stage on a re-check', async () => {
    const c = await setUp();
    const s = await c.step({ title: 'Torque the hold-downs' });
    const f = (await c.crew.agent.post(`${c.base}/steps/${s.id}/fasteners`).send(spec)).body
      .fastener;
    const url = `${c.base}/fasteners/${f.id}/readings`;
    const third = await c.crew.agent
      .post(url)
      .send({ position: 1, value: 41, unit: 'lbf-ft', stage: 3 });
    expect(third.status).toBe(400);
    expect(third.body.error.fields).toEqual({
      stage: 'Choose a stage from 1 to 2, or the final torque',
    });
    const recheck = await c.crew.agent
      .post(url)
      .send({ position: 1, value: 41, unit: 'lbf-ft', stage: 1, retorque: true });
    expect(recheck.status).toBe(400);
    expect(recheck.body.error.fields.stage).toBeTruthy();
    const zero = await c.crew.agent
      .post(url)
      .send({ position: 1, value: 41, unit: 'lbf-ft', stage: 0 });
    expect(zero.status).toBe(400);
    // Stages that hold readings stay.
    await c.crew.agent.post(url).send({ position: 1, value: 80, unit: 'lbf-ft', stage: 2 });
    const fewer = await c.crew.agent.patch(`${c.base}/fasteners/${f.id}`).send({ stages: [40] });
    expect(fewer.status).toBe(400);
    expect(fewer.body.error.fields.stages).toMatch(/Stage 2 already has readings/);
  });

  it('names positions by cylinder in the spec and in what blocks the sign-off', async () => {
    const c = await setUp();
    const s = await c.step({ title: 'Seat the injectors' });
    const names = ['Cyl 1', 'Cyl 2'];
    const f = (
      await c.crew.agent
        .post(`${c.base}/steps/${s.id}/fasteners`)
        .send({ ...spec, positionNames: names })
    ).body.fastener;
    expect(f.positionNames).toEqual(names);
    const step = (await c.crew.agent.get(`${c.base}/steps/${s.id}`)).body.step;
    expect(step.signOffBlockers[0].message).toBe(
      'Injector hold-down bolts: no reading for Cyl 1, Cyl 2',
    );

    const wrong = await c.crew.agent
      .post(`${c.base}/steps/${s.id}/fasteners`)
      .send({ ...spec, positionNames: ['Cyl 1'] });
    expect(wrong.status).toBe(400);
    expect(wrong.body.error.fields.positionNames).toBe('Give 2 names, one per position, or none');
    const more = await c.crew.agent.patch(`${c.base}/fasteners/${f.id}`).send({ count: 3 });
    expect(more.status).toBe(400);
    expect(more.body.error.fields.positionNames).toBeTruthy();
    const cleared = await c.crew.agent
      .patch(`${c.base}/fasteners/${f.id}`)
      .send({ count: 3, positionNames: [] });
    expect(cleared.body.fastener.positionNames).toEqual([]);
  });
});

describe('torque wrenches', () => {
  it('are each person’s own: listed, renamed and deleted only by them', async () => {
    const c = await setUp();
    const made = await c.crew.agent
      .post('/api/me/wrenches')
      .send({ name: '3/8 in. click, 10–80 lbf·ft', calibratedOn: '2026-01-15' });
    expect(made.status, JSON.stringify(made.body)).toBe(201);
    const id = made.body.wrench.id;
    expect((await c.crew.agent.get('/api/me/wrenches')).body.wrenches).toEqual([made.body.wrench]);
    expect((await c.owner.agent.get('/api/me/wrenches')).body.wrenches).toEqual([]);
    expect(
      (await c.owner.agent.patch(`/api/me/wrenches/${id}`).send({ name: 'Mine' })).status,
    ).toBe(404);
    expect((await c.owner.agent.delete(`/api/me/wrenches/${id}`)).status).toBe(404);
    expect((await app.agent().get('/api/me/wrenches')).status).toBe(401);
    const twice = await c.crew.agent
      .post('/api/me/wrenches')
      .send({ name: '3/8 IN. CLICK, 10–80 LBF·FT' });
    expect(twice.status).toBe(409);
    expect(twice.body.error.fields.name).toBeTruthy();
    const bad = await c.crew.agent
      .post('/api/me/wrenches')
      .send({ name: '', calibratedOn: '15/01/2026' });
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.body.error.fields).sort()).toEqual(['calibratedOn', 'name']);
    const renamed = await c.crew.agent
      .patch(`/api/me/wrenches/${id}`)
      .send({ name: 'Click wrench #2', calibratedOn: null });
    expect(renamed.body.wrench).toMatchObject({ name: 'Click wrench #2', calibratedOn: null });
    await c.crew.agent.delete(`/api/me/wrenches/${id}`).expect(204);
  });

  it('warn (never refuse) on a reading taken with a wrench past the owner’s interval', async () => {
    const c = await setUp();
    const s = await c.step({ title: 'Torque the hold-downs' });
    const f = (await c.crew.agent.post(`${c.base}/steps/${s.id}/fasteners`).send(spec)).body
      .fastener;
    const url = `${c.base}/fasteners/${f.id}/readings`;
    const old = (
      await c.crew.agent
        .post('/api/me/wrenches')
        .send({ name: 'Old beam wrench', calibratedOn: monthsAgo(14) })
    ).body.wrench;
    const fresh = (
      await c.crew.agent
        .post('/api/me/wrenches')
        .send({ name: 'New click wrench', calibratedOn: monthsAgo(1) })
    ).body.wrench;

    const late = await c.crew.agent
      .post(url)
      .send({ position: 1, value: 100, unit: 'lbf-ft', wrenchId: old.id });
    expect(late.status).toBe(201);
    expect(late.body.reading).toMatchObject({
      wrench: 'Old beam wrench',
      wrenchId: old.id,
      calibration: { calibratedOn: monthsAgo(14), overdue: true },
    });
    expect(late.body.warnings).toEqual([
      expect.stringMatching(/^Old beam wrench was due for calibration on \d{4}-\d\d-\d\d/),
    ]);
    const ok = await c.crew.agent
      .post(url)
      .send({ position: 2, value: 100, unit: 'lbf-ft', wrenchId: fresh.id });
    expect(ok.body.reading.calibration).toMatchObject({ overdue: false });
    expect(ok.body.warnings).toEqual([]);

    // The owner sets a longer interval for this build: the same wrench is in date again.
    const patched = await c.owner.agent.patch(c.base).send({ wrenchCalibrationMonths: 24 });
    expect(patched.body.build.wrenchCalibrationMonths).toBe(24);
    const again = await c.crew.agent
      .post(url)
      .send({ position: 1, value: 100, unit: 'lbf-ft', wrenchId: old.id });
    expect(again.body.reading.calibration.overdue).toBe(false);
    // The earlier reading keeps the interval it was taken under.
    const history = (await c.crew.agent.get(url)).body.readings;
    expect(
      history.find((r: { id: string }) => r.id === late.body.reading.id).calibration.overdue,
    ).toBe(true);
    expect((await c.crew.agent.patch(c.base).send({ wrenchCalibrationMonths: 24 })).status).toBe(
      403,
    );
    const zero = await c.owner.agent.patch(c.base).send({ wrenchCalibrationMonths: 0 });
    expect(zero.status).toBe(400);
    expect(zero.body.error.fields.wrenchCalibrationMonths).toBeTruthy();
  });

  it('are refused on a reading when they are someone else’s', async () => {
    const c = await setUp();
    const s = await c.step({ title: 'Torque the hold-downs' });
    const f = (await c.crew.agent.post(`${c.base}/steps/${s.id}/fasteners`).send(spec)).body
      .fastener;
    const owners = (await c.owner.agent.post('/api/me/wrenches').send({ name: 'Owner’s wrench' }))
      .body.wrench;
    const res = await c.crew.agent
      .post(`${c.base}/fasteners/${f.id}/readings`)
      .send({ position: 1, value: 100, unit: 'lbf-ft', wrenchId: owners.id });
    expect(res.status).toBe(400);
    expect(res.body.error.fields).toEqual({
      wrenchId: 'Choose one of your wrenches, or add it first',
    });
  });
});

describe('cautions the author ticks', () => {
  it('are suggested from the words while nobody has chosen, and shown as ticked once chosen', async () => {
    const c = await setUp();
    const pump = await c.step({ title: 'Replacing the high-pressure pump' });
    expect(pump.cautions.map((x: { id: string }) => x.id)).toEqual(['high-pressure-fuel']);
    expect(pump.cautionChoice).toBeNull();

    const cab = await c.step({
      title: 'Pulling the cab',
      description: 'Wipe everything down first.',
      cautions: ['lifting', 'critical-fastener'],
    });
    expect(cab.cautionChoice).toEqual(['lifting', 'critical-fastener']);
    expect(cab.liftsVehicle).toBe(true);
    expect(cab.cautions.map((x: { id: string }) => x.id)).toEqual(['lifting', 'critical-fastener']);

    // Ticked means shown, whatever the words; unticked means not shown.
    const wipe = await c.step({ title: 'Wipe down', cautions: ['high-pressure-fuel'] });
    expect(wipe.cautions.map((x: { id: string }) => x.id)).toEqual(['high-pressure-fuel']);
    const none = await c.crew.agent
      .patch(`${c.base}/steps/${pump.id}`)
      .send({ cautions: [] })
      .expect(200);
    expect(none.body.step.cautions).toEqual([]);
    expect(none.body.step.cautionChoice).toEqual([]);
    // The older off-the-ground mark adds lifting to the ticks.
    const lifted = await c.crew.agent
      .patch(`${c.base}/steps/${pump.id}`)
      .send({ liftsVehicle: true })
      .expect(200);
    expect(lifted.body.step.cautionChoice).toEqual(['lifting']);

    const bad = await c.crew.agent
      .post(`${c.base}/jobs/${c.job.id}/steps`)
      .send({ title: 'X', cautions: ['fire'] });
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.body.error.fields)).toEqual(['cautions.0']);
  });
});
