import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { seedDemo } from '@db/seeds/demo';
import { listJobs } from '@server/features/install-log/jobs.service';
import { listRetorqueChecks } from '@server/features/install-log/retorque.service';
import { getStep } from '@server/features/install-log/steps.service';
import { createLocalDiskStorage } from '@server/lib/storage';
import { useTestApp, type Agent } from '../helpers/app';
import { addMember, buildWithCast, moneyKeys, signUp } from '../helpers/factories';

const app = useTestApp();

/** 100 lbf·ft ± 5 %: the band is 95–105 lbf·ft = 128.80–142.36 N·m (NIST SP 811 (2008) B.9: × 1.355818). */
const holdDown = {
  name: 'Injector hold-down bolts',
  count: 2,
  targetValue: 100,
  targetUnit: 'lbf-ft',
  toleranceType: 'percent',
  toleranceValue: 5,
  stages: [40, 80],
  threadCondition: 'oiled',
  sequenceNote: 'Both bolts to stage 1, then stage 2, then final',
  specSource: "Maker's service manual, fuel system section (owner's entry)",
};

/** A build with every role, a shop part and a garage part, a job and two steps. */
async function castWithJob() {
  const cast = await buildWithCast(app);
  const { owner, crew, build } = cast;
  const base = `/api/builds/${build.id}`;
  const shopPart = (
    await owner.agent.post(`${base}/parts`).send({
      category: 'fuel-injection',
      name: 'Injectors, new nozzles',
      status: 'at-shop',
      shopUserId: cast.shop.id,
      sentOutOn: '2026-01-05',
      labourCents: 90_000,
    })
  ).body.part;
  const studs = (
    await owner.agent
      .post(`${base}/parts`)
      .send({ category: 'head-and-studs', name: 'Head studs', status: 'in-hand' })
  ).body.part;
  const jobRes = await owner.agent
    .post(`${base}/jobs`)
    .send({ title: 'Fit the rebuilt injectors', notes: 'Weekend job' });
  expect(jobRes.status, JSON.stringify(jobRes.body)).toBe(201);
  const job = jobRes.body.job;
  const stepA = (
    await crew.agent.post(`${base}/jobs/${job.id}/steps`).send({
      title: 'Seat the injectors',
      description: 'New copper washers; clean the bores first.',
      partIds: [shopPart.id],
    })
  ).body.step;
  const stepB = (
    await owner.agent
      .post(`${base}/jobs/${job.id}/steps`)
      .send({ title: 'Torque the head studs', partIds: [studs.id], liftsVehicle: true })
  ).body.step;
  const spec = (await crew.agent.post(`${base}/steps/${stepA.id}/fasteners`).send(holdDown)).body
    .fastener;
  const item = (
    await crew.agent
      .post(`${base}/steps/${stepA.id}/checklist`)
      .send({ label: 'New seal and crush washer fitted' })
  ).body.item;
  const specB = (
    await owner.agent
      .post(`${base}/steps/${stepB.id}/fasteners`)
      .send({ ...holdDown, name: 'Head studs', count: 1, stages: [], retorqueAfterHeatCycles: 3 })
  ).body.fastener;
  const itemB = (
    await owner.agent.post(`${base}/steps/${stepB.id}/checklist`).send({ label: 'Studs cleaned' })
  ).body.item;
  return { ...cast, base, job, stepA, stepB, spec, specB, item, itemB, shopPart, studs };
}

const reading = (agent: Agent, base: string, specId: string, body: Record<string, unknown>) =>
  agent.post(`${base}/fasteners/${specId}/readings`).send(body);

describe('install log: jobs, steps, checklist and fastener specs', () => {
  it('builds a job of ordered steps with parts, checklist, specs and cautions', async () => {
    const { owner, base, job, stepA, stepB, spec, item } = await castWithJob();
    expect(stepA).toMatchObject({ position: 1, status: 'not-started', jobId: job.id });
    expect(stepB.position).toBe(2);
    expect(item).toMatchObject({
      label: 'New seal and crush washer fitted',
      done: false,
      doneBy: null,
    });
    // The spec comes back with its band and its restatement in N·m.
    expect(spec).toMatchObject({
      name: 'Injector hold-down bolts',
      count: 2,
      targetUnit: 'lbf-ft',
      stages: [40, 80],
      threadCondition: 'oiled',
    });
    expect(spec.band).toEqual({ low: 95, high: 105, unit: 'lbf-ft' });
    expect(spec.alt.unit).toBe('n-m');
    expect(spec.alt.target).toBeCloseTo(135.582, 3); // NIST SP 811 (2008) B.9: 100 × 1.355818
    expect(spec.positions).toEqual([
      { position: 1, current: null, retorque: null, stages: [null, null], supersededCount: 0 },
      { position: 2, current: null, retorque: null, stages: [null, null], supersededCount: 0 },
    ]);

    const step = (await owner.agent.get(`${base}/steps/${stepA.id}`)).body.step;
    expect(step.parts.map((p: { name: string }) => p.name)).toEqual(['Injectors, new nozzles']);
    expect(step.cautions.map((c: { id: string }) => c.id)).toEqual([
      'high-pressure-fuel',
      'service-information',
    ]);
    expect(step.signOffBlockers.map((b: { kind: string }) => b.kind)).toEqual([
      'missing-readings',
      'unticked',
    ]);
    expect(moneyKeys(step)).toEqual([]);
    const b = (await owner.agent.get(`${base}/steps/${stepB.id}`)).body.step;
    // Head studs (linked part and words) suggest the critical-fastener caution (issue 20).
    expect(b.cautions.map((c: { id: string }) => c.id)).toEqual([
      'lifting',
      'critical-fastener',
      'service-information',
    ]);

    const jobs = (await owner.agent.get(`${base}/jobs`)).body.jobs;
    expect(jobs).toHaveLength(1);
    expect(jobs[0].steps.map((s: { title: string }) => s.title)).toEqual([
      'Seat the injectors',
      'Torque the head studs',
    ]);
    expect(jobs[0].steps[0].progress).toEqual({
      checklistDone: 0,
      checklistTotal: 1,
      positionsRecorded: 0,
      positionsTotal: 2,
      outOfSpec: 0,
    });
  });

  it('moves steps to a new place and renumbers the rest', async () => {
    const { crew, base, job, stepA, stepB } = await castWithJob();
    const c = (
      await crew.agent
        .post(`${base}/jobs/${job.id}/steps`)
        .send({ title: 'Prime the fuel system', position: 1 })
    ).body.step;
    expect(c.position).toBe(1);
    let steps = (await crew.agent.get(`${base}/jobs/${job.id}`)).body.job.steps;
    expect(steps.map((s: { id: string }) => s.id)).toEqual([c.id, stepA.id, stepB.id]);
    await crew.agent.patch(`${base}/steps/${c.id}`).send({ position: 3 }).expect(200);
    steps = (await crew.agent.get(`${base}/jobs/${job.id}`)).body.job.steps;
    expect(steps.map((s: { id: string; position: number }) => [s.id, s.position])).toEqual([
      [stepA.id, 1],
      [stepB.id, 2],
      [c.id, 3],
    ]);
  });

  it('ticks and unticks a checklist item, recording who and when', async () => {
    const { crew, base, item, stepA } = await castWithJob();
    const ticked = await crew.agent.patch(`${base}/checklist/${item.id}`).send({ done: true });
    expect(ticked.status).toBe(200);
    expect(ticked.body.item).toMatchObject({
      done: true,
      doneBy: { id: crew.id, name: crew.displayName },
    });
    expect(Date.parse(ticked.body.item.doneAt)).toBeGreaterThan(Date.now() - 60_000);
    expect((await crew.agent.get(`${base}/steps/${stepA.id}`)).body.step.status).toBe('under-way');
    const unticked = await crew.agent.patch(`${base}/checklist/${item.id}`).send({ done: false });
    expect(unticked.body.item).toMatchObject({ done: false, doneBy: null, doneAt: null });
  });

  it('refuses contradictory specs, parts of another build and positions past the count', async () => {
    const { owner, base, stepA, spec } = await castWithJob();
    const bad = await owner.agent
      .post(`${base}/steps/${stepA.id}/fasteners`)
      .send({ ...holdDown, toleranceType: 'value', toleranceValue: 100 });
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields).toHaveProperty('toleranceValue');
    const noSource = await owner.agent
      .post(`${base}/steps/${stepA.id}/fasteners`)
      .send({ ...holdDown, specSource: '' });
    expect(noSource.status).toBe(400);
    expect(noSource.body.error.fields.specSource).toMatch(/service manual/);
    const badUnit = await owner.agent
      .post(`${base}/steps/${stepA.id}/fasteners`)
      .send({ ...holdDown, targetUnit: 'kgf-m' });
    expect(badUnit.body.error.fields).toHaveProperty('targetUnit');

    const other = await buildWithCast(app);
    const foreign = (
      await other.owner.agent
        .post(`/api/builds/${other.build.id}/parts`)
        .send({ category: 'other', name: 'Not yours' })
    ).body.part;
    const link = await owner.agent
      .patch(`${base}/steps/${stepA.id}`)
      .send({ partIds: [foreign.id] });
    expect(link.status).toBe(400);
    expect(link.body.error.fields).toHaveProperty('partIds');

    const past = await reading(owner.agent, base, spec.id, {
      position: 3,
      value: 100,
      unit: 'lbf-ft',
    });
    expect(past.status).toBe(400);
    expect(past.body.error.fields.position).toMatch(/1 to 2/);
    const status = await owner.agent
      .patch(`${base}/steps/${stepA.id}`)
      .send({ status: 'signed-off' });
    expect(status.status).toBe(400);
  });
});

describe('torque readings', () => {
  it('converts a reading in another unit and marks it in spec, under or over', async () => {
    const { crew, base, spec } = await castWithJob();
    // 135 N·m = 99.57 lbf·ft; 125 N·m = 92.19 lbf·ft (NIST SP 811 (2008) B.9: 1 lbf·ft = 1.355818 N·m)
    const inSpec = await reading(crew.agent, base, spec.id, {
      position: 1,
      value: 135,
      unit: 'n-m',
      wrench: 'Click wrench, 3/8 in. drive',
    });
    expect(inSpec.status).toBe(201);
    expect(inSpec.body.reading).toMatchObject({
      position: 1,
      value: 135,
      unit: 'n-m',
      verdict: 'in-spec',
      kind: 'install',
      wrench: 'Click wrench, 3/8 in. drive',
    });
    expect(inSpec.body.reading.valueInSpecUnit).toBeCloseTo(99.5709, 4);
    expect(inSpec.body.reading.recordedBy).toEqual({ id: crew.id, name: crew.displayName });
    const under = await reading(crew.agent, base, spec.id, {
      position: 2,
      value: 125,
      unit: 'n-m',
    });
    expect(under.body.reading.verdict).toBe('under');
    const over = await reading(crew.agent, base, spec.id, {
      position: 2,
      value: 1300,
      unit: 'lbf-in',
    }); // 108.33 lbf·ft
    expect(over.body.reading.verdict).toBe('over');
    expect(over.body.fastener.positions[1].current.id).toBe(over.body.reading.id);
  });

  it('keeps the tolerance edge in spec when read in another unit', async () => {
    const { crew, base, spec } = await castWithJob();
    // Bottom edge 95 lbf·ft = 1140 lbf·in exactly (NIST SP 811 (2008) B.8: ft = 12 in).
    const edge = await reading(crew.agent, base, spec.id, {
      position: 1,
      value: 1140,
      unit: 'lbf-in',
    });
    expect(edge.body.reading.verdict).toBe('in-spec');
    const below = await reading(crew.agent, base, spec.id, {
      position: 2,
      value: 1139.9,
      unit: 'lbf-in',
    });
    expect(below.body.reading.verdict).toBe('under');
  });

  it('never edits a reading: a correction supersedes it and the old one is kept', async () => {
    const { crew, owner, base, spec } = await castWithJob();
    const first = (
      await reading(crew.agent, base, spec.id, { position: 1, value: 88, unit: 'lbf-ft' })
    ).body.reading;
    expect(first.verdict).toBe('under');
    const fix = await reading(crew.agent, base, spec.id, {
      position: 1,
      value: 101,
      unit: 'lbf-ft',
      note: 'Re-did it after cleaning the threads',
    });
    expect(fix.status).toBe(201);
    expect(fix.body.supersededId).toBe(first.id);
    expect(fix.body.fastener.positions[0]).toMatchObject({
      supersededCount: 1,
      current: { id: fix.body.reading.id, verdict: 'in-spec' },
    });

    const history = (await owner.agent.get(`${base}/fasteners/${spec.id}/readings`)).body.readings;
    expect(history).toHaveLength(2);
    const old = history.find((r: { id: string }) => r.id === first.id);
    expect(old).toMatchObject({ value: 88, verdict: 'under', supersededById: fix.body.reading.id });
    expect(old.supersededAt).not.toBeNull();
    expect(history.find((r: { id: string }) => r.id === fix.body.reading.id)).toMatchObject({
      supersededById: null,
      supersededAt: null,
    });
    // Exactly one current reading per position in the database, too.
    const rows = await app.db
      .knex('torque_readings')
      .where({ spec_id: spec.id, position: 1 })
      .select('superseded_at');
    expect(rows.filter((r) => r.superseded_at === null)).toHaveLength(1);
    expect(rows).toHaveLength(2);
  });

  it('lets only the owner change the target of a spec that has readings, and re-judges them', async () => {
    const { crew, owner, base, spec } = await castWithJob();
    await reading(crew.agent, base, spec.id, { position: 1, value: 110, unit: 'lbf-ft' });
    const crewEdit = await crew.agent
      .patch(`${base}/fasteners/${spec.id}`)
      .send({ targetValue: 110 });
    expect(crewEdit.status).toBe(403);
    expect(
      (await crew.agent.patch(`${base}/fasteners/${spec.id}`).send({ sequenceNote: 'Centre out' }))
        .status,
    ).toBe(200);
    const ownerEdit = await owner.agent
      .patch(`${base}/fasteners/${spec.id}`)
      .send({ targetValue: 110 });
    expect(ownerEdit.status).toBe(200);
    expect(ownerEdit.body.fastener.positions[0].current.verdict).toBe('in-spec');
  });

  it('refuses to lower the count below a position that holds a reading', async () => {
    const { owner, crew, base, spec } = await castWithJob();
    expect(
      (await owner.agent.patch(`${base}/fasteners/${spec.id}`).send({ count: 4 })).status,
    ).toBe(200);
    await reading(crew.agent, base, spec.id, { position: 3, value: 100, unit: 'lbf-ft' });
    const tooFew = await owner.agent.patch(`${base}/fasteners/${spec.id}`).send({ count: 2 });
    expect(tooFew.status).toBe(400);
    expect(tooFew.body.error.fields.count).toMatch(/Position 3 already has a reading/);
    const row = await app.db.knex('fastener_specs').where({ id: spec.id }).first('count');
    expect(row.count).toBe(4);
    const enough = await owner.agent.patch(`${base}/fasteners/${spec.id}`).send({ count: 3 });
    expect(enough.status).toBe(200);
    expect(enough.body.fastener.count).toBe(3);
  });

  it('queues a notice when a reading is out of spec', async () => {
    const { crew, owner, viewer, base, spec } = await castWithJob();
    await reading(crew.agent, base, spec.id, { position: 1, value: 80, unit: 'lbf-ft' });
    const mails = await app.db
      .knex('mail_outbox')
      .where({ kind: 'notice:torque-out-of-spec' })
      .whereIn('to_address', [owner.email, viewer.email, crew.email]);
    expect(mails.map((m) => m.to_address).sort()).toEqual([owner.email, viewer.email].sort());
    expect(mails[0].body_text).toMatch(/80 lbf·ft on Injector hold-down bolts #1/);
  });
});

describe('sign-off', () => {
  async function allInSpec(c: Awaited<ReturnType<typeof castWithJob>>) {
    await reading(c.crew.agent, c.base, c.spec.id, {
      position: 1,
      value: 100,
      unit: 'lbf-ft',
    }).expect(201);
    await reading(c.crew.agent, c.base, c.spec.id, { position: 2, value: 136, unit: 'n-m' }).expect(
      201,
    );
    await c.crew.agent.patch(`${c.base}/checklist/${c.item.id}`).send({ done: true }).expect(200);
  }

  it('is refused while a current reading is out of spec; crew may not override; the owner may, with a reason', async () => {
    const c = await castWithJob();
    await allInSpec(c);
    await reading(c.crew.agent, c.base, c.spec.id, {
      position: 2,
      value: 90,
      unit: 'lbf-ft',
    }).expect(201);
    const url = `${c.base}/steps/${c.stepA.id}/sign-off`;

    const refused = await c.crew.agent.post(url).send({});
    expect(refused.status).toBe(409);
    expect(refused.body.error.code).toBe('sign_off_blocked');
    expect(refused.body.error.fields).toEqual({
      [`fasteners.${c.spec.id}.2`]: expect.stringMatching(/#2: under spec \(90 lbf·ft\)/),
    });
    expect((await c.owner.agent.post(url).send({})).status).toBe(409);

    const crewOverride = await c.crew.agent.post(url).send({ overrideReason: 'Good enough' });
    expect(crewOverride.status).toBe(403);
    const empty = await c.owner.agent.post(url).send({ overrideReason: '' });
    expect(empty.status).toBe(400);

    const overridden = await c.owner.agent
      .post(url)
      .send({ overrideReason: 'Bolt #2 re-checked with a second wrench; reads 101' });
    expect(overridden.status).toBe(200);
    const step = overridden.body.step;
    expect(step.status).toBe('signed-off');
    expect(step.signOff).toMatchObject({
      by: { id: c.owner.id },
      override: {
        reason: 'Bolt #2 re-checked with a second wrench; reads 101',
        blockers: [{ kind: 'out-of-spec', position: 2 }],
      },
    });
    expect(step.signOffBlockers).toEqual([]);
    // The out-of-spec reading is still on record.
    expect(step.fasteners[0].positions[1].current.verdict).toBe('under');
  });

  it('is refused while positions lack readings or checks are unticked, and allowed once all is in spec', async () => {
    const c = await castWithJob();
    const url = `${c.base}/steps/${c.stepA.id}/sign-off`;
    const missing = await c.crew.agent.post(url).send({});
    expect(missing.status).toBe(409);
    expect(Object.keys(missing.body.error.fields).sort()).toEqual(
      [`checklist.${c.item.id}`, `fasteners.${c.spec.id}`].sort(),
    );

    // A correction into spec clears the blocker: only the current reading counts.
    await reading(c.crew.agent, c.base, c.spec.id, {
      position: 1,
      value: 80,
      unit: 'lbf-ft',
    }).expect(201);
    await allInSpec(c);
    const ok = await c.crew.agent.post(url).send({});
    expect(ok.status).toBe(200);
    expect(ok.body.step.signOff).toMatchObject({
      by: { id: c.crew.id, name: c.crew.displayName },
      override: null,
    });
    expect(Date.parse(ok.body.step.signOff.at)).toBeGreaterThan(Date.now() - 60_000);
    expect((await c.crew.agent.post(url).send({})).body.error.code).toBe('already_signed_off');

    const mails = await app.db
      .knex('mail_outbox')
      .where({ kind: 'notice:step-signed-off', to_address: c.owner.email });
    expect(mails).toHaveLength(1);
    expect(mails[0].subject).toMatch(/Step signed off: Seat the injectors/);
  });

  it('locks a signed-off step until the owner reopens it', async () => {
    const c = await castWithJob();
    await allInSpec(c);
    await c.crew.agent.post(`${c.base}/steps/${c.stepA.id}/sign-off`).send({}).expect(200);
    const late = await reading(c.crew.agent, c.base, c.spec.id, {
      position: 1,
      value: 100,
      unit: 'lbf-ft',
    });
    expect(late.status).toBe(409);
    expect(late.body.error.code).toBe('step_signed_off');
    expect(
      (await c.crew.agent.patch(`${c.base}/checklist/${c.item.id}`).send({ done: false })).status,
    ).toBe(409);
    expect(
      (await c.crew.agent.patch(`${c.base}/fasteners/${c.spec.id}`).send({ count: 3 })).status,
    ).toBe(409);
    expect((await c.crew.agent.delete(`${c.base}/steps/${c.stepA.id}/sign-off`)).status).toBe(403);
    const reopened = await c.owner.agent.delete(`${c.base}/steps/${c.stepA.id}/sign-off`);
    expect(reopened.status).toBe(200);
    expect(reopened.body.step).toMatchObject({ status: 'under-way', signOff: null });
    expect(
      (await reading(c.crew.agent, c.base, c.spec.id, { position: 1, value: 100, unit: 'lbf-ft' }))
        .status,
    ).toBe(201);
  });
});

describe('re-torque checks', () => {
  it('lists a check once its step is signed off, and closes it when every position re-reads in spec', async () => {
    const c = await castWithJob();
    const url = `${c.base}/retorque-checks`;
    expect((await c.crew.agent.get(url)).body.checks).toEqual([]);
    const all = (await c.crew.agent.get(`${url}?status=all`)).body.checks;
    expect(all).toHaveLength(1);
    expect(all[0]).toMatchObject({
      specId: c.specB.id,
      state: 'waiting',
      afterHeatCycles: 3,
      description: 'after 3 heat cycles',
    });

    const early = await reading(c.crew.agent, c.base, c.specB.id, {
      position: 1,
      value: 100,
      unit: 'lbf-ft',
      retorque: true,
    });
    expect(early.status).toBe(409);
    await reading(c.crew.agent, c.base, c.specB.id, {
      position: 1,
      value: 100,
      unit: 'lbf-ft',
    }).expect(201);
    await c.crew.agent.patch(`${c.base}/checklist/${c.itemB.id}`).send({ done: true }).expect(200);
    await c.crew.agent.post(`${c.base}/steps/${c.stepB.id}/sign-off`).send({}).expect(200);

    const open = (await c.viewer.agent.get(url)).body.checks;
    expect(open).toHaveLength(1);
    expect(open[0]).toMatchObject({
      state: 'open',
      stepTitle: 'Torque the head studs',
      jobTitle: 'Fit the rebuilt injectors',
      positionsLeft: [1],
    });
    expect(open[0].since).not.toBeNull();

    const low = await reading(c.crew.agent, c.base, c.specB.id, {
      position: 1,
      value: 90,
      unit: 'lbf-ft',
      retorque: true,
    });
    expect(low.status).toBe(201);
    expect(low.body.reading).toMatchObject({ kind: 'retorque', verdict: 'under' });
    expect((await c.crew.agent.get(url)).body.checks).toHaveLength(1);
    const good = await reading(c.crew.agent, c.base, c.specB.id, {
      position: 1,
      value: 101,
      unit: 'lbf-ft',
      retorque: true,
    });
    expect(good.body.fastener.positions[0]).toMatchObject({
      retorque: { verdict: 'in-spec' },
      current: { value: 100 },
    });
    expect((await c.crew.agent.get(url)).body.checks).toEqual([]);
    expect((await c.crew.agent.get(`${url}?status=all`)).body.checks[0].state).toBe('done');

    // A spec that asks for no re-check takes no re-torque readings.
    const none = await reading(c.crew.agent, c.base, c.spec.id, {
      position: 1,
      value: 100,
      unit: 'lbf-ft',
      retorque: true,
    });
    expect(none.status).toBe(400);
  });

  it('can be closed by hand with a note', async () => {
    const c = await castWithJob();
    await c.owner.agent
      .post(`${c.base}/steps/${c.stepB.id}/sign-off`)
      .send({ overrideReason: 'Fitted before Headroom' })
      .expect(200);
    const closed = await c.crew.agent
      .post(`${c.base}/retorque-checks/${c.specB.id}/close`)
      .send({ note: 'Re-checked by the machine shop' });
    expect(closed.status).toBe(200);
    expect(closed.body.check).toMatchObject({
      state: 'done',
      closeNote: 'Re-checked by the machine shop',
      closedBy: { id: c.crew.id },
    });
    expect((await c.crew.agent.get(`${c.base}/retorque-checks`)).body.checks).toEqual([]);
    expect(
      (
        await c.crew.agent
          .post(`${c.base}/retorque-checks/${c.specB.id}/close`)
          .send({ note: 'again' })
      ).status,
    ).toBe(409);
  });
});

describe('install log: who may do what', () => {
  it('shows a shop only the steps linked to its parts', async () => {
    const c = await castWithJob();
    const jobs = (await c.shop.agent.get(`${c.base}/jobs`)).body.jobs;
    expect(jobs).toHaveLength(1);
    expect(jobs[0].steps.map((s: { id: string }) => s.id)).toEqual([c.stepA.id]);
    expect((await c.shop.agent.get(`${c.base}/jobs/${c.job.id}`)).body.job.steps).toHaveLength(1);
    expect((await c.shop.agent.get(`${c.base}/steps/${c.stepA.id}`)).status).toBe(200);
    expect((await c.shop.agent.get(`${c.base}/fasteners/${c.spec.id}/readings`)).status).toBe(200);
    expect((await c.shop.agent.get(`${c.base}/steps/${c.stepB.id}`)).status).toBe(404);
    expect((await c.shop.agent.get(`${c.base}/fasteners/${c.specB.id}/readings`)).status).toBe(404);
    expect((await c.shop.agent.get(`${c.base}/retorque-checks?status=all`)).body.checks).toEqual(
      [],
    );
    const step = (await c.shop.agent.get(`${c.base}/steps/${c.stepA.id}`)).body.step;
    expect(moneyKeys(step)).toEqual([]);

    // Another shop on the build sees no step at all.
    const otherShop = await signUp(app, 'othershop');
    await addMember(c.owner, c.build.id, otherShop, 'shop');
    expect((await otherShop.agent.get(`${c.base}/jobs`)).body.jobs).toEqual([]);
    expect((await otherShop.agent.get(`${c.base}/jobs/${c.job.id}`)).status).toBe(404);
    expect((await otherShop.agent.get(`${c.base}/steps/${c.stepA.id}`)).status).toBe(404);
  });

  it('shows a shop only the parts sent to it among a step’s linked parts, while the owner sees them all', async () => {
    const c = await castWithJob();
    // Step A fits the shop's injectors and, now, the garage's head studs.
    await c.owner.agent
      .patch(`${c.base}/steps/${c.stepA.id}`)
      .send({ partIds: [c.shopPart.id, c.studs.id] })
      .expect(200);
    const ids = (step: { parts: { id: string }[] }) => step.parts.map((p) => p.id).sort();

    const shopStep = (await c.shop.agent.get(`${c.base}/steps/${c.stepA.id}`).expect(200)).body
      .step;
    expect(shopStep.parts).toEqual([
      {
        id: c.shopPart.id,
        name: 'Injectors, new nozzles',
        category: 'fuel-injection',
        status: 'at-shop',
      },
    ]);
    const shopJobs = (await c.shop.agent.get(`${c.base}/jobs`).expect(200)).body;
    const shopJob = (await c.shop.agent.get(`${c.base}/jobs/${c.job.id}`).expect(200)).body;
    for (const answer of [shopStep, shopJobs, shopJob]) {
      expect(JSON.stringify(answer)).not.toContain(c.studs.id);
    }

    for (const member of [c.owner, c.crew, c.viewer]) {
      const step = (await member.agent.get(`${c.base}/steps/${c.stepA.id}`).expect(200)).body.step;
      expect(ids(step)).toEqual([c.shopPart.id, c.studs.id].sort());
    }
  });

  it('lets a viewer read everything and write nothing', async () => {
    const c = await castWithJob();
    const v = c.viewer.agent;
    for (const path of [
      '/jobs',
      `/jobs/${c.job.id}`,
      `/steps/${c.stepA.id}`,
      `/steps/${c.stepB.id}`,
      `/fasteners/${c.spec.id}/readings`,
      '/retorque-checks',
    ]) {
      expect((await v.get(c.base + path)).status, path).toBe(200);
    }
    for (const [method, path, body] of writeRoutes(c)) {
      expect((await v[method](c.base + path).send(body)).status, `${method} ${path}`).toBe(403);
    }
  });

  it('lets the crew write but not delete, override or reopen', async () => {
    const c = await castWithJob();
    const crew = c.crew.agent;
    expect(
      (await crew.patch(`${c.base}/jobs/${c.job.id}`).send({ title: 'Fit the injectors' })).status,
    ).toBe(200);
    expect(
      (await crew.patch(`${c.base}/steps/${c.stepA.id}`).send({ status: 'under-way' })).status,
    ).toBe(200);
    expect(
      (
        await crew
          .patch(`${c.base}/checklist/${c.item.id}`)
          .send({ label: 'Seal and crush washer new' })
      ).status,
    ).toBe(200);
    for (const path of [
      `/jobs/${c.job.id}`,
      `/steps/${c.stepA.id}`,
      `/checklist/${c.item.id}`,
      `/fasteners/${c.spec.id}`,
      `/steps/${c.stepA.id}/sign-off`,
    ]) {
      expect((await crew.delete(c.base + path)).status, path).toBe(403);
    }
    expect((await c.owner.agent.delete(`${c.base}/fasteners/${c.specB.id}`)).status).toBe(204);
    expect((await c.owner.agent.delete(`${c.base}/checklist/${c.itemB.id}`)).status).toBe(204);
    expect((await c.owner.agent.delete(`${c.base}/steps/${c.stepB.id}`)).status).toBe(204);
    expect((await c.owner.agent.get(`${c.base}/steps/${c.stepB.id}`)).status).toBe(404);
    expect((await c.owner.agent.delete(`${c.base}/jobs/${c.job.id}`)).status).toBe(204);
    expect((await c.owner.agent.get(`${c.base}/jobs`)).body.jobs).toEqual([]);
    expect((await c.owner.agent.get(`${c.base}/steps/${c.stepA.id}`)).status).toBe(404);
  });

  it('refuses a shop every write (403), a stranger everything (404) and a signed-out caller everything (401)', async () => {
    const c = await castWithJob();
    for (const [method, path, body] of writeRoutes(c)) {
      expect(
        (await c.shop.agent[method](c.base + path).send(body)).status,
        `shop ${method} ${path}`,
      ).toBe(403);
    }
    const everything = [...readRoutes(c), ...writeRoutes(c)];
    for (const [agent, expected] of [
      [c.stranger.agent, 404],
      [app.agent(), 401],
    ] as const) {
      for (const [method, path, body] of everything) {
        expect(
          (await agent[method](c.base + path).send(body)).status,
          `${expected} ${method} ${path}`,
        ).toBe(expected);
      }
    }
    // Nothing changed.
    const step = (await c.owner.agent.get(`${c.base}/steps/${c.stepA.id}`)).body.step;
    expect(step.fasteners[0].positions[0].current).toBeNull();
    expect(step.status).toBe('not-started');
  });

  it('answers 404 for ids that are malformed or belong to another build', async () => {
    const c = await castWithJob();
    const other = await castWithJob();
    // The owner of one build addressing the other build's step through their own build.
    expect((await c.owner.agent.get(`${c.base}/steps/${other.stepA.id}`)).status).toBe(404);
    expect((await c.owner.agent.get(`${c.base}/fasteners/${other.spec.id}/readings`)).status).toBe(
      404,
    );
    expect(
      (await c.owner.agent.patch(`${c.base}/checklist/${other.item.id}`).send({ done: true }))
        .status,
    ).toBe(404);
    expect((await c.owner.agent.get(`${c.base}/steps/not-a-uuid`)).status).toBe(404);
    expect((await c.owner.agent.get(`${c.base}/jobs/${other.job.id}`)).status).toBe(404);
  });
});

type Method = 'get' | 'post' | 'patch' | 'delete';
type Route = [Method, string, Record<string, unknown>];
type Cast = Awaited<ReturnType<typeof castWithJob>>;

function readRoutes(c: Cast): Route[] {
  return [
    ['get', '/jobs', {}],
    ['get', `/jobs/${c.job.id}`, {}],
    ['get', `/steps/${c.stepA.id}`, {}],
    ['get', `/fasteners/${c.spec.id}/readings`, {}],
    ['get', '/retorque-checks', {}],
  ];
}

function writeRoutes(c: Cast): Route[] {
  return [
    ['post', '/jobs', { title: 'x' }],
    ['patch', `/jobs/${c.job.id}`, { title: 'x' }],
    ['delete', `/jobs/${c.job.id}`, {}],
    ['post', `/jobs/${c.job.id}/steps`, { title: 'x' }],
    ['patch', `/steps/${c.stepA.id}`, { title: 'x' }],
    ['delete', `/steps/${c.stepA.id}`, {}],
    ['post', `/steps/${c.stepA.id}/sign-off`, {}],
    ['delete', `/steps/${c.stepA.id}/sign-off`, {}],
    ['post', `/steps/${c.stepA.id}/checklist`, { label: 'x' }],
    ['patch', `/checklist/${c.item.id}`, { done: true }],
    ['delete', `/checklist/${c.item.id}`, {}],
    ['post', `/steps/${c.stepA.id}/fasteners`, holdDown],
    ['patch', `/fasteners/${c.spec.id}`, { count: 4 }],
    ['delete', `/fasteners/${c.spec.id}`, {}],
    ['post', `/fasteners/${c.spec.id}/readings`, { position: 1, value: 100, unit: 'lbf-ft' }],
    ['post', `/retorque-checks/${c.specB.id}/close`, { note: 'x' }],
  ];
}

describe('demo data', () => {
  it('seeds a believable install log with readings, a correction, an open re-torque check and photos, quickly', async () => {
    const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'headroom-seed-'));
    const rollback = new Error('rollback');
    try {
      await app.db.knex
        .transaction(async (trx) => {
          const started = Date.now();
          const { buildId, userIds } = await seedDemo(trx, {
            storage: createLocalDiskStorage(dir),
          });
          expect(Date.now() - started).toBeLessThan(5_000);
          const crew = {
            knex: trx,
            buildId,
            caller: { userId: userIds.crew, role: 'crew' as const },
          };
          const jobs = await listJobs(crew);
          expect(jobs.map((j) => j.title)).toEqual([
            'Fit the down-pipe and EGT probe',
            'Fit the rebuilt injectors',
          ]);
          expect(jobs[0].steps.every((s) => s.status === 'signed-off')).toBe(true);
          expect(jobs[1].steps.map((s) => s.status)).toEqual([
            'signed-off',
            'under-way',
            'not-started',
            'not-started',
          ]);

          const pipe = await getStep(crew, jobs[0].steps[1].id);
          const flange = pipe.fasteners.find((f) => f.name === 'Down-pipe flange nuts')!;
          expect(flange.positions.map((p) => p.current?.verdict)).toEqual([
            'in-spec',
            'in-spec',
            'in-spec',
          ]);
          expect(flange.positions[1].supersededCount).toBe(1);
          expect(flange.specSource).toMatch(/Demo values only/);
          expect(pipe.photoCount).toBe(1);
          const probe = await getStep(crew, jobs[0].steps[2].id);
          // 20.5 N·m read against 180 lbf·in ± 10 %: 181.44 lbf·in (NIST SP 811 (2008) B.9: 1 lbf·in = 0.1129848 N·m).
          expect(probe.fasteners[0].positions[0].current).toMatchObject({
            unit: 'n-m',
            verdict: 'in-spec',
          });
          expect(probe.fasteners[0].positions[0].current!.valueInSpecUnit).toBeCloseTo(181.44, 2);

          const open = await listRetorqueChecks(crew, 'open');
          expect(open.map((c) => c.specName)).toEqual(['Down-pipe flange nuts']);
          const seat = await getStep(crew, jobs[1].steps[2].id);
          expect(seat.cautions.map((c) => c.id)).toEqual([
            'high-pressure-fuel',
            'service-information',
          ]);

          const photos = await trx('photos').where({ build_id: buildId });
          expect(photos).toHaveLength(5);
          for (const p of photos) {
            expect(fs.existsSync(path.join(dir, p.web_key))).toBe(true);
            expect(fs.existsSync(path.join(dir, p.thumb_key))).toBe(true);
          }
          throw rollback;
        })
        .catch((err) => {
          if (err !== rollback) throw err;
        });
    } finally {
      fs.rmSync(dir, { recursive: true, force: true });
    }
  });
});
