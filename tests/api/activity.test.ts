/**
 * Recent activity on a build's overview (issue 20): what happened lately, for every role,
 * filtered by what the role may see — a shop only its parts and their steps — and with no
 * money in it for anyone.
 */
import sharp from 'sharp';
import { describe, expect, it } from 'vitest';
import { useTestApp } from '../helpers/app';
import { buildWithCast, moneyKeys } from '../helpers/factories';

const app = useTestApp();

const png = () =>
  sharp({ create: { width: 64, height: 48, channels: 3, background: '#5a7d9a' } })
    .png()
    .toBuffer();

async function busyBuild() {
  const cast = await buildWithCast(app);
  const base = `/api/builds/${cast.build.id}`;
  const post = async (agent: typeof cast.owner.agent, url: string, body: object) => {
    const res = await agent.post(url).send(body);
    expect(res.status, JSON.stringify(res.body)).toBeLessThan(300);
    return res.body;
  };
  const injectors = (
    await post(cast.owner.agent, `${base}/parts`, {
      category: 'fuel-injection',
      name: 'Injector set',
      status: 'at-shop',
      shopUserId: cast.shop.id,
      sentOutOn: '2026-01-05',
      labourCents: 90_000,
    })
  ).part;
  const studs = (
    await post(cast.owner.agent, `${base}/parts`, {
      category: 'head-and-studs',
      name: 'Head studs',
      status: 'in-hand',
      orderedOn: '2026-01-02',
      receivedOn: '2026-01-10',
      unitPriceCents: 64_900,
    })
  ).part;
  const job = (await post(cast.owner.agent, `${base}/jobs`, { title: 'Top end' })).job;
  const seat = (
    await post(cast.crew.agent, `${base}/jobs/${job.id}/steps`, {
      title: 'Seat the injectors',
      partIds: [injectors.id],
    })
  ).step;
  await post(cast.crew.agent, `${base}/steps/${seat.id}/checklist`, { label: 'Bores clean' });
  const torque = (
    await post(cast.crew.agent, `${base}/jobs/${job.id}/steps`, {
      title: 'Torque the head studs',
      partIds: [studs.id],
    })
  ).step;
  await post(cast.owner.agent, `${base}/steps/${seat.id}/sign-off`, {
    overrideReason: 'Checked by the shop',
  });
  await post(cast.crew.agent, `${base}/steps/${torque.id}/sign-off`, {});
  const photo = await png();
  expect(
    (
      await cast.crew.agent
        .post(`${base}/steps/${torque.id}/photos`)
        .attach('photos', photo, 'studs.png')
    ).status,
  ).toBe(201);
  expect(
    (
      await cast.shop.agent
        .post(`${base}/parts/${injectors.id}/photos`)
        .attach('photos', photo, 'a.png')
        .attach('photos', photo, 'b.png')
    ).status,
  ).toBe(201);
  return { ...cast, base, injectors, studs, seat, torque };
}

type Event = {
  kind: string;
  day: string;
  at: string | null;
  subject: { type: string; id: string; name: string };
  by: { name: string } | null;
  count?: number;
  overridden?: boolean;
  shopName?: string;
};
const summary = (events: Event[]) =>
  events.map((e) => `${e.kind}: ${e.subject.name}${e.count ? ` ×${e.count}` : ''}`).sort();

describe('recent activity', () => {
  it('shows the owner, crew and viewer everything that happened, newest first, without money', async () => {
    const c = await busyBuild();
    for (const m of [c.owner, c.crew, c.viewer]) {
      const res = await m.agent.get(`${c.base}/activity`);
      expect(res.status).toBe(200);
      expect(summary(res.body.events)).toEqual([
        'part-arrived: Head studs',
        'part-ordered: Head studs',
        'part-sent-out: Injector set',
        'photos-added: Injector set ×2',
        'photos-added: Torque the head studs ×1',
        'step-signed-off: Seat the injectors',
        'step-signed-off: Torque the head studs',
      ]);
      expect(moneyKeys(res.body)).toEqual([]);
    }
    const { events } = (await c.viewer.agent.get(`${c.base}/activity`)).body as {
      events: Event[];
    };
    const days = events.map((e) => e.day);
    expect([...days].sort().reverse()).toEqual(days);
    const seat = events.find((e) => e.subject.name === 'Seat the injectors')!;
    expect(seat).toMatchObject({ overridden: true, by: { name: c.owner.displayName } });
    const sent = events.find((e) => e.kind === 'part-sent-out')!;
    expect(sent).toMatchObject({ day: '2026-01-05', shopName: c.shop.displayName });
  });

  it('shows a shop only its own parts, the steps that use them and their photos', async () => {
    const c = await busyBuild();
    const res = await c.shop.agent.get(`${c.base}/activity`);
    expect(res.status).toBe(200);
    expect(summary(res.body.events)).toEqual([
      'part-sent-out: Injector set',
      'photos-added: Injector set ×2',
      'step-signed-off: Seat the injectors',
    ]);
    expect(moneyKeys(res.body)).toEqual([]);
  });

  it('answers a stranger 404 and a signed-out caller 401', async () => {
    const c = await buildWithCast(app);
    const url = `/api/builds/${c.build.id}/activity`;
    expect((await c.stranger.agent.get(url)).status).toBe(404);
    expect((await app.agent().get(url)).status).toBe(401);
    expect((await c.viewer.agent.get(url)).body.events).toEqual([]);
  });
});
