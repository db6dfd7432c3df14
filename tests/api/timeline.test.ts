import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { seedDemo } from '@db/seeds/demo';
import { getTimeline } from '@server/features/timeline/timeline.service';
import { createLocalDiskStorage } from '@server/lib/storage';
import { addDays, todayIn } from '@shared/dates';
import type { Timeline } from '@shared/schemas/timeline';
import { useTestApp } from '../helpers/app';
import { addMember, buildWithCast, createBuild, moneyKeys, signUp } from '../helpers/factories';

const app = useTestApp();

/**
 * A build counted in Denver whose target is 40 days out (cut-off at 33 with the default
 * buffer), with a part late by 2 days, one exactly on the cut-off, a send-out at the shop
 * member due back in time, another shop's part, a milestone past due and one ahead, and a
 * job of three steps.
 */
async function scenario() {
  const cast = await buildWithCast(app);
  const { owner, shop, build } = cast;
  const base = `/api/builds/${build.id}`;
  const otherShop = await signUp(app, 'othershop');
  await addMember(owner, build.id, otherShop, 'shop');
  const today = todayIn('America/Denver');
  const day = (n: number) => addDays(today, n);
  await owner.agent
    .patch(`/api/builds/${build.id}`)
    .send({ targetDate: day(40), targetEvent: 'Test pull', timeZone: 'America/Denver' })
    .expect(200);
  const part = async (body: Record<string, unknown>) =>
    (
      await owner.agent
        .post(`${base}/parts`)
        .send({ category: 'other', ...body })
        .expect(201)
    ).body.part;
  const late = await part({
    name: 'Late intercooler',
    category: 'cooling',
    status: 'ordered',
    expectedOn: day(35),
    unitPriceCents: 123_456,
  });
  const onCutoff = await part({ name: 'On-time cooler', status: 'ordered', expectedOn: day(33) });
  const shopPart = await part({
    name: 'Injector set at the shop',
    category: 'fuel-injection',
    status: 'at-shop',
    shopUserId: shop.id,
    sentOutOn: day(-5),
    turnaroundDays: 14,
    labourCents: 77_700,
  });
  const otherShopPart = await part({
    name: 'Transmission at another shop',
    category: 'transmission',
    status: 'at-shop',
    shopUserId: otherShop.id,
    sentOutOn: day(-10),
    turnaroundDays: 5,
  });
  const pastDue = (
    await owner.agent
      .post(`${base}/milestones`)
      .send({ title: 'Order the turbo', dueOn: day(-2) })
      .expect(201)
  ).body.milestone;
  const ahead = (
    await owner.agent
      .post(`${base}/milestones`)
      .send({ title: 'Engine back together', dueOn: day(20) })
      .expect(201)
  ).body.milestone;
  const job = (await owner.agent.post(`${base}/jobs`).send({ title: 'Fit the turbo' }).expect(201))
    .body.job;
  for (const title of ['Drain and remove', 'Fit the turbo', 'Prime and start']) {
    await owner.agent.post(`${base}/jobs/${job.id}/steps`).send({ title }).expect(201);
  }
  return {
    ...cast,
    otherShop,
    base,
    day,
    late,
    onCutoff,
    shopPart,
    otherShopPart,
    pastDue,
    ahead,
    job,
  };
}

const timelineOf = async (
  agent: { get: (u: string) => PromiseLike<{ body: unknown }> },
  base: string,
) => ((await agent.get(`${base}/timeline`)) as { body: { timeline: Timeline } }).body.timeline;

describe('GET /api/builds/:buildId/timeline', () => {
  it('gives the owner the countdown, the cut-off, the threats by rule and every dated item', async () => {
    const s = await scenario();
    const res = await s.owner.agent.get(`${s.base}/timeline`);
    expect(res.status).toBe(200);
    const t: Timeline = res.body.timeline;
    expect(t.timeZone).toBe('America/Denver');
    expect(t.timeZoneChosen).toBe(true);
    expect(t.today).toBe(s.day(0));
    expect(t.target).toEqual({
      date: s.day(40),
      event: 'Test pull',
      daysLeft: 40,
      cutoff: s.day(33),
    });
    expect(t.settings).toEqual({ bufferDays: 7, stepsPerWeek: null });
    expect(t.threats.map((x) => [x.rule, x.title, x.missesByDays])).toEqual([
      ['part-late', 'Late intercooler', 2],
      ['send-out-overdue', 'Transmission at another shop', 5],
      ['milestone-past-due', 'Order the turbo', 2],
    ]);
    expect(t.threats[0].link).toEqual({ to: 'part', partId: s.late.id, name: 'Late intercooler' });
    expect(t.readiness).toEqual({ state: 'threatened', words: '3 things threaten the date' });
    const keys = t.items.map((i) => i.key);
    expect(keys).toEqual(
      expect.arrayContaining([
        `target:${s.build.id}`,
        `part-expected:${s.late.id}`,
        `part-expected:${s.onCutoff.id}`,
        `send-out-due:${s.shopPart.id}`,
        `milestone:${s.ahead.id}`,
      ]),
    );
    // Earliest first; only threatened items are marked.
    expect(t.items.map((i) => i.date)).toEqual([...t.items.map((i) => i.date)].sort());
    expect(t.items.find((i) => i.key === `part-expected:${s.onCutoff.id}`)?.threatened).toBe(false);
    expect(t.items.find((i) => i.key === `part-expected:${s.late.id}`)?.threatened).toBe(true);
    expect(t.milestones?.map((m) => m.title)).toEqual(['Order the turbo', 'Engine back together']);
  });

  it('projects jobs at the owner’s pace and flags the one that cannot fit', async () => {
    const s = await scenario();
    // 3 steps at 0.5 a week: 42 days, two past the target.
    const res = await s.owner.agent
      .patch(`${s.base}/timeline/settings`)
      .send({ stepsPerWeek: 0.5 });
    expect(res.status).toBe(200);
    const t: Timeline = res.body.timeline;
    expect(t.settings.stepsPerWeek).toBe(0.5);
    const threat = t.threats.find((x) => x.rule === 'job-behind')!;
    expect(threat).toMatchObject({ title: 'Fit the turbo', missesByDays: 2, date: s.day(42) });
    expect(threat.link).toMatchObject({ to: 'step' });
    // At a step a week: 21 days, in time.
    await s.owner.agent.patch(`${s.base}/timeline/settings`).send({ stepsPerWeek: 1 }).expect(200);
    const again = await timelineOf(s.owner.agent, s.base);
    expect(again.threats.some((x) => x.rule === 'job-behind')).toBe(false);
    expect(again.items.find((i) => i.kind === 'job')).toMatchObject({
      date: s.day(21),
      inCalendar: false,
    });
  });

  it('moves the cut-off with the buffer: 5 days puts the late part on time', async () => {
    const s = await scenario();
    const res = await s.owner.agent.patch(`${s.base}/timeline/settings`).send({ bufferDays: 5 });
    expect(res.body.timeline.target.cutoff).toBe(s.day(35));
    expect(res.body.timeline.threats.map((x: { rule: string }) => x.rule)).not.toContain(
      'part-late',
    );
  });

  it('gives crew and viewers the same dates, with no money anywhere', async () => {
    const s = await scenario();
    const owner = await timelineOf(s.owner.agent, s.base);
    for (const m of [s.owner, s.crew, s.viewer]) {
      const res = await m.agent.get(`${s.base}/timeline`);
      expect(res.status).toBe(200);
      expect(res.body.timeline.items).toEqual(owner.items);
      expect(moneyKeys(res.body)).toEqual([]);
      expect(JSON.stringify(res.body)).not.toMatch(/123456|1234\.56|77700|777\.00|\$/);
    }
  });

  it('shows a shop the target and only the parts sent to it: no milestones, jobs or other parts', async () => {
    const s = await scenario();
    const res = await s.shop.agent.get(`${s.base}/timeline`);
    expect(res.status).toBe(200);
    const t: Timeline = res.body.timeline;
    expect(t.items.map((i) => i.key).sort()).toEqual(
      [`target:${s.build.id}`, `send-out-due:${s.shopPart.id}`].sort(),
    );
    expect(t.threats).toEqual([]);
    // Its line speaks of its own parts: a plain "On track" would read as the whole build's.
    expect(t.readiness).toEqual({ state: 'on-track', words: 'Your parts are on track' });
    expect(t.milestones).toBeNull();
    expect(JSON.stringify(res.body)).not.toMatch(/Late intercooler|Transmission|Order the turbo/);
    const other = await timelineOf(s.otherShop.agent, s.base);
    expect(other.threats.map((x) => x.title)).toEqual(['Transmission at another shop']);
    expect(other.readiness.words).toBe('1 of your parts threatens the date');
  });

  it('carries dyno days as dated items: every one for the owner, a shop only those at its dyno', async () => {
    const s = await scenario();
    const url = `${s.base}/dyno-sessions`;
    const booked = (
      await s.owner.agent
        .post(url)
        .send({ date: s.day(38), dynoKind: 'chassis', place: 'Mesa Diesel', shopUserId: s.shop.id })
        .expect(201)
    ).body.session;
    const other = (
      await s.owner.agent
        .post(url)
        .send({ date: s.day(12), dynoKind: 'engine' })
        .expect(201)
    ).body.session;
    const owner = await timelineOf(s.owner.agent, s.base);
    expect(owner.items.find((i) => i.key === `dyno-session:${booked.id}`)).toMatchObject({
      kind: 'dyno-session',
      date: s.day(38),
      title: 'Dyno day at Mesa Diesel',
      detail: 'Chassis dyno',
      inCalendar: true,
      threatened: false,
      link: { to: 'dyno-session', sessionId: booked.id },
    });
    expect(owner.items.some((i) => i.key === `dyno-session:${other.id}`)).toBe(true);
    const shop = await timelineOf(s.shop.agent, s.base);
    expect(shop.items.filter((i) => i.kind === 'dyno-session').map((i) => i.key)).toEqual([
      `dyno-session:${booked.id}`,
    ]);
    const otherShop = await timelineOf(s.otherShop.agent, s.base);
    expect(otherShop.items.some((i) => i.kind === 'dyno-session')).toBe(false);
  });

  it('answers 404 to a stranger and to a build that does not exist, 401 signed out', async () => {
    const s = await scenario();
    expect((await s.stranger.agent.get(`${s.base}/timeline`)).status).toBe(404);
    expect(
      (await s.owner.agent.get('/api/builds/00000000-0000-4000-8000-000000000000/timeline')).status,
    ).toBe(404);
    expect((await app.agent().get(`${s.base}/timeline`)).status).toBe(401);
  });

  it('counts in UTC until a time zone is chosen, and takes a new build’s zone from its creator', async () => {
    const owner = await signUp(app, 'owner');
    const plain = await createBuild(owner);
    const t = await timelineOf(owner.agent, `/api/builds/${plain.id}`);
    expect(t).toMatchObject({ timeZone: 'UTC', timeZoneChosen: false, today: todayIn('UTC') });
    const zoned = await createBuild(owner, { timeZone: 'america/denver' });
    expect(zoned.timeZone).toBe('America/Denver');
    const z = await timelineOf(owner.agent, `/api/builds/${zoned.id}`);
    expect(z).toMatchObject({ timeZone: 'America/Denver', today: todayIn('America/Denver') });
  });

  it('says when there is no target date, and threatens no part', async () => {
    const owner = await signUp(app, 'owner');
    const b = await createBuild(owner, { targetDate: null });
    const base = `/api/builds/${b.id}`;
    await owner.agent
      .post(`${base}/parts`)
      .send({ category: 'other', name: 'Rated', ratingValue: 500, ratingUnit: 'hp-crank' })
      .expect(201);
    const t = await timelineOf(owner.agent, base);
    expect(t.target).toEqual({ date: null, event: 'Test dyno day', daysLeft: null, cutoff: null });
    expect(t.readiness).toEqual({ state: 'no-target', words: 'No target date set' });
    expect(t.threats).toEqual([]);
  });
});

describe('PATCH /api/builds/:buildId/timeline/settings', () => {
  it('lets only the owner change them: 403 for crew, shop and viewer, 404 stranger, 401 signed out', async () => {
    const s = await scenario();
    const url = `${s.base}/timeline/settings`;
    for (const m of [s.crew, s.shop, s.viewer]) {
      expect((await m.agent.patch(url).send({ bufferDays: 3 })).status).toBe(403);
    }
    expect((await s.stranger.agent.patch(url).send({ bufferDays: 3 })).status).toBe(404);
    expect((await app.agent().patch(url).send({ bufferDays: 3 })).status).toBe(401);
    const ok = await s.owner.agent
      .patch(url)
      .send({ bufferDays: 0, stepsPerWeek: 2.5, timeZone: 'Pacific/Auckland' });
    expect(ok.status).toBe(200);
    expect(ok.body.timeline).toMatchObject({
      timeZone: 'Pacific/Auckland',
      settings: { bufferDays: 0, stepsPerWeek: 2.5 },
    });
    // Clearing the pace switches the jobs' check off again.
    const cleared = await s.owner.agent.patch(url).send({ stepsPerWeek: null });
    expect(cleared.body.timeline.settings).toEqual({ bufferDays: 0, stepsPerWeek: null });
  });

  it('refuses a buffer below 0 or over 365 days, a pace of 0 and an unknown time zone, naming the field', async () => {
    const s = await scenario();
    const url = `${s.base}/timeline/settings`;
    const cases: [Record<string, unknown>, string][] = [
      [{ bufferDays: -1 }, 'bufferDays'],
      [{ bufferDays: 366 }, 'bufferDays'],
      [{ bufferDays: 2.5 }, 'bufferDays'],
      [{ bufferDays: '7' }, 'bufferDays'],
      [{ stepsPerWeek: 0 }, 'stepsPerWeek'],
      [{ stepsPerWeek: -2 }, 'stepsPerWeek'],
      [{ timeZone: 'Mars/Olympus' }, 'timeZone'],
      [{ timeZone: '+02:00' }, 'timeZone'],
      [{ timeZone: 7 }, 'timeZone'],
      [{ bufferDays: 3, bufferDaze: 3 }, 'bufferDaze'],
    ];
    for (const [body, field] of cases) {
      const res = await s.owner.agent.patch(url).send(body);
      expect(res.status, JSON.stringify(body)).toBe(400);
      expect(Object.keys(res.body.error.fields), JSON.stringify(body)).toEqual([field]);
    }
    expect((await s.owner.agent.patch(url).send({})).status).toBe(400);
    expect(
      (await s.owner.agent.patch(`/api/builds/${s.build.id}`).send({ timeZone: 'Nowhere/Land' }))
        .body.error.fields,
    ).toEqual({ timeZone: expect.stringContaining('time zone') });
    // Nothing was changed by the refused requests.
    expect((await timelineOf(s.owner.agent, s.base)).settings).toEqual({
      bufferDays: 7,
      stepsPerWeek: null,
    });
  });
});

describe('/api/builds/:buildId/milestones', () => {
  it('lets the owner add, change, tick off and remove a milestone', async () => {
    const s = await scenario();
    const url = `${s.base}/milestones`;
    const created = await s.owner.agent
      .post(url)
      .send({ title: '  First start  ', dueOn: s.day(30) });
    expect(created.status).toBe(201);
    expect(created.body.milestone).toMatchObject({
      title: 'First start',
      dueOn: s.day(30),
      done: false,
    });
    const id = created.body.milestone.id;
    const done = await s.owner.agent.patch(`${url}/${id}`).send({ done: true, dueOn: s.day(31) });
    expect(done.body.milestone).toMatchObject({ done: true, dueOn: s.day(31) });
    // The past-due milestone stops threatening once done.
    await s.owner.agent.patch(`${url}/${s.pastDue.id}`).send({ done: true }).expect(200);
    const t = await timelineOf(s.owner.agent, s.base);
    expect(t.threats.map((x) => x.rule)).not.toContain('milestone-past-due');
    expect((await s.owner.agent.delete(`${url}/${id}`)).status).toBe(204);
    expect((await s.owner.agent.delete(`${url}/${id}`)).status).toBe(404);
    expect((await s.owner.agent.get(url)).body.milestones.map((m: { id: string }) => m.id)).toEqual(
      [s.pastDue.id, s.ahead.id],
    );
  });

  it('lets crew and viewers read; refuses their writes with 403 and a shop even reading', async () => {
    const s = await scenario();
    const url = `${s.base}/milestones`;
    for (const m of [s.crew, s.viewer]) {
      expect((await m.agent.get(url)).status).toBe(200);
      expect((await m.agent.post(url).send({ title: 'x', dueOn: s.day(1) })).status).toBe(403);
      expect((await m.agent.patch(`${url}/${s.ahead.id}`).send({ done: true })).status).toBe(403);
      expect((await m.agent.delete(`${url}/${s.ahead.id}`)).status).toBe(403);
    }
    expect((await s.shop.agent.get(url)).status).toBe(403);
    expect((await s.shop.agent.post(url).send({ title: 'x', dueOn: s.day(1) })).status).toBe(403);
    expect((await s.stranger.agent.get(url)).status).toBe(404);
    expect((await s.stranger.agent.delete(`${url}/${s.ahead.id}`)).status).toBe(404);
    expect((await app.agent().get(url)).status).toBe(401);
    expect(
      (
        await app
          .agent()
          .post(url)
          .send({ title: 'x', dueOn: s.day(1) })
      ).status,
    ).toBe(401);
  });

  it('refuses dates that are not dates and other bad fields, naming them', async () => {
    const s = await scenario();
    const url = `${s.base}/milestones`;
    const cases: [Record<string, unknown>, string][] = [
      [{ title: 'x', dueOn: 'next Tuesday' }, 'dueOn'],
      [{ title: 'x', dueOn: '2027-02-30' }, 'dueOn'],
      [{ title: 'x', dueOn: '30/05/2027' }, 'dueOn'],
      [{ title: 'x', dueOn: 20270530 }, 'dueOn'],
      [{ title: 'x', dueOn: '3000-01-01' }, 'dueOn'],
      [{ title: 'x' }, 'dueOn'],
      [{ title: '   ', dueOn: '2027-05-30' }, 'title'],
      [{ title: 'x'.repeat(121), dueOn: '2027-05-30' }, 'title'],
      [{ title: 'x', dueOn: '2027-05-30', done: 'yes' }, 'done'],
    ];
    for (const [body, field] of cases) {
      const res = await s.owner.agent.post(url).send(body);
      expect(res.status, JSON.stringify(body)).toBe(400);
      expect(Object.keys(res.body.error.fields), JSON.stringify(body)).toEqual([field]);
    }
    const patch = await s.owner.agent.patch(`${url}/${s.ahead.id}`).send({ dueOn: 'soon' });
    expect(patch.status).toBe(400);
    expect(patch.body.error.fields).toHaveProperty('dueOn');
  });

  it('answers 404 for another build’s milestone and for a malformed id', async () => {
    const s = await scenario();
    const other = await createBuild(s.owner);
    const url = `/api/builds/${other.id}/milestones`;
    expect((await s.owner.agent.patch(`${url}/${s.ahead.id}`).send({ done: true })).status).toBe(
      404,
    );
    expect((await s.owner.agent.delete(`${url}/${s.ahead.id}`)).status).toBe(404);
    expect((await s.owner.agent.patch(`${url}/not-an-id`).send({ done: true })).status).toBe(404);
  });
});

describe('demo data', () => {
  it('gives the demo build a believable timeline with one real threat: the backordered intercooler', async () => {
    const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'headroom-seed-'));
    const rollback = new Error('rollback');
    try {
      await app.db.knex
        .transaction(async (trx) => {
          const { buildId, userIds } = await seedDemo(trx, {
            storage: createLocalDiskStorage(dir),
          });
          const as = (role: 'owner' | 'shop') => ({
            knex: trx,
            buildId,
            caller: { userId: userIds[role], role },
          });
          const t = await getTimeline(as('owner'));
          expect(t.timeZone).toBe('America/Denver');
          expect(t.settings).toEqual({ bufferDays: 7, stepsPerWeek: 3 });
          expect(t.threats.map((x) => [x.rule, x.title, x.missesByDays])).toEqual([
            ['part-late', 'Front-mount intercooler, bar-and-plate', 5],
          ]);
          expect(t.readiness.words).toBe('1 thing threatens the date');
          const kinds = new Set(t.items.map((i) => i.kind));
          expect([...kinds].sort()).toEqual(
            ['dyno-session', 'job', 'milestone', 'part-expected', 'send-out-due', 'target'].sort(),
          );
          expect(t.milestones).toHaveLength(6);
          // The shop's own view: its injectors due back, and the date; nothing threatened.
          const shop = await getTimeline(as('shop'));
          expect(shop.items.map((i) => i.kind).sort()).toEqual(['send-out-due', 'target']);
          expect(shop.threats).toEqual([]);
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
