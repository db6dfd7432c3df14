/**
 * Offline queue writes (issue 17): a create sent twice with one Idempotency-Key is stored
 * once and answered the same; the key is per user; a reused key with another body is
 * refused; a reading sent late keeps the time it was taken, within bounds, and is refused
 * when its step was signed off or its target changed meanwhile.
 */
import { randomUUID } from 'node:crypto';
import sharp from 'sharp';
import { describe, expect, it } from 'vitest';
import { useTestApp } from '../helpers/app';
import { buildWithCast } from '../helpers/factories';

const app = useTestApp();

const spec = {
  name: 'Rocker arm bolts',
  count: 4,
  targetValue: 30,
  targetUnit: 'lbf-ft',
  toleranceType: 'percent',
  toleranceValue: 5,
  threadCondition: 'oiled',
  specSource: "Maker's service manual, valve train section (test entry)",
};
const target = {
  targetValue: 30,
  targetUnit: 'lbf-ft',
  toleranceType: 'percent',
  toleranceValue: 5,
};

async function setUp() {
  const cast = await buildWithCast(app);
  const base = `/api/builds/${cast.build.id}`;
  const job = (await cast.owner.agent.post(`${base}/jobs`).send({ title: 'Valve train' })).body.job;
  const step = (
    await cast.crew.agent.post(`${base}/jobs/${job.id}/steps`).send({ title: 'Fit the rockers' })
  ).body.step;
  const fastener = (await cast.crew.agent.post(`${base}/steps/${step.id}/fasteners`).send(spec))
    .body.fastener;
  const readings = `${base}/fasteners/${fastener.id}/readings`;
  const count = async () =>
    Number(
      (
        await app.db
          .knex('torque_readings')
          .where({ spec_id: fastener.id })
          .count<{ count: string }[]>('id as count')
      )[0].count,
    );
  return { ...cast, base, step, fastener, readings, count };
}

const minutesAgo = (n: number) => new Date(Date.now() - n * 60_000).toISOString();

describe('Idempotency-Key on recording a reading', () => {
  it('stores a reading sent twice with one key once and answers the same both times', async () => {
    const c = await setUp();
    const key = randomUUID();
    const body = { position: 1, value: 31, unit: 'lbf-ft' };
    const first = await c.crew.agent.post(c.readings).set('Idempotency-Key', key).send(body);
    expect(first.status, JSON.stringify(first.body)).toBe(201);
    const again = await c.crew.agent.post(c.readings).set('Idempotency-Key', key).send(body);
    expect(again.status).toBe(201);
    expect(again.headers['idempotent-replayed']).toBe('true');
    expect(again.body).toEqual(first.body);
    expect(await c.count()).toBe(1);
    // The first answer was not a superseding one, and the repeat does not supersede it either.
    const list = (await c.crew.agent.get(c.readings)).body.readings;
    expect(list).toHaveLength(1);
    expect(list[0].supersededById).toBeNull();
  });

  it('stores one row when both copies arrive at once', async () => {
    const c = await setUp();
    const key = randomUUID();
    const body = { position: 2, value: 29, unit: 'lbf-ft' };
    const [a, b] = await Promise.all([
      c.crew.agent.post(c.readings).set('Idempotency-Key', key).send(body),
      c.crew.agent.post(c.readings).set('Idempotency-Key', key).send(body),
    ]);
    expect([a.status, b.status]).toEqual([201, 201]);
    expect(a.body.reading.id).toBe(b.body.reading.id);
    expect(await c.count()).toBe(1);
  });

  it('refuses a different body sent with a key already used, storing nothing more', async () => {
    const c = await setUp();
    const key = randomUUID();
    await c.crew.agent
      .post(c.readings)
      .set('Idempotency-Key', key)
      .send({ position: 1, value: 31, unit: 'lbf-ft' })
      .expect(201);
    const other = await c.crew.agent
      .post(c.readings)
      .set('Idempotency-Key', key)
      .send({ position: 1, value: 35, unit: 'lbf-ft' });
    expect(other.status).toBe(422);
    expect(other.body.error.code).toBe('idempotency_key_reused');
    expect(other.body.error.message).toMatch(/different request/);
    expect(await c.count()).toBe(1);
  });

  it('keeps keys per user: the same key from another member is another write', async () => {
    const c = await setUp();
    const key = randomUUID();
    const body = { position: 3, value: 30, unit: 'lbf-ft' };
    await c.crew.agent.post(c.readings).set('Idempotency-Key', key).send(body).expect(201);
    const owner = await c.owner.agent.post(c.readings).set('Idempotency-Key', key).send(body);
    expect(owner.status).toBe(201);
    expect(owner.headers['idempotent-replayed']).toBeUndefined();
    expect(owner.body.reading.recordedBy.id).toBe(c.owner.id);
    expect(await c.count()).toBe(2);
  });

  it('answers 400 naming the header when the key is not a UUID', async () => {
    const c = await setUp();
    const res = await c.crew.agent
      .post(c.readings)
      .set('Idempotency-Key', 'again-please')
      .send({ position: 1, value: 30, unit: 'lbf-ft' });
    expect(res.status).toBe(400);
    expect(res.body.error.fields['Idempotency-Key']).toMatch(/UUID/);
    expect(await c.count()).toBe(0);
  });

  it('keeps no key for a refused write, so the same key may be sent again', async () => {
    const c = await setUp();
    const key = randomUUID();
    const refused = await c.crew.agent
      .post(c.readings)
      .set('Idempotency-Key', key)
      .send({ position: 9, value: 30, unit: 'lbf-ft' });
    expect(refused.status).toBe(400);
    const rows = await app.db.knex('idempotency_keys').where({ user_id: c.crew.id, key });
    expect(rows).toHaveLength(0);
  });

  it('removes keys older than seven days when a keyed write comes in', async () => {
    const c = await setUp();
    const old = randomUUID();
    const recent = randomUUID();
    await app.db.knex('idempotency_keys').insert([
      {
        user_id: c.crew.id,
        key: old,
        request_hash: 'x',
        response_status: 201,
        response_body: '{}',
        created_at: app.db.knex.raw(`now() - interval '7 days 1 hour'`),
      },
      {
        user_id: c.crew.id,
        key: recent,
        request_hash: 'x',
        response_status: 201,
        response_body: '{}',
        created_at: app.db.knex.raw(`now() - interval '6 days 23 hours'`),
      },
    ]);
    await c.crew.agent
      .post(c.readings)
      .set('Idempotency-Key', randomUUID())
      .send({ position: 1, value: 30, unit: 'lbf-ft' })
      .expect(201);
    const left = await app.db.knex('idempotency_keys').whereIn('key', [old, recent]).pluck('key');
    expect(left).toEqual([recent]);
  });
});

describe('Idempotency-Key on uploading photos', () => {
  const jpeg = (colour: string) =>
    sharp({ create: { width: 64, height: 48, channels: 3, background: colour } })
      .jpeg()
      .toBuffer();

  it('stores photos sent twice with one key once; other photos with that key are refused', async () => {
    const c = await setUp();
    const url = `${c.base}/steps/${c.step.id}/photos`;
    const key = randomUUID();
    const file = await jpeg('#336699');
    const send = (data: Buffer) =>
      c.crew.agent
        .post(url)
        .set('Idempotency-Key', key)
        .field('caption', 'Rockers torqued')
        .attach('photos', data, 'rockers.jpg');
    const first = await send(file);
    expect(first.status, JSON.stringify(first.body)).toBe(201);
    const again = await send(file);
    expect(again.status).toBe(201);
    expect(again.body.photos.map((p: { id: string }) => p.id)).toEqual(
      first.body.photos.map((p: { id: string }) => p.id),
    );
    expect((await c.crew.agent.get(url)).body.photos).toHaveLength(1);
    const other = await send(await jpeg('#993333'));
    expect(other.status).toBe(422);
    expect((await c.crew.agent.get(url)).body.photos).toHaveLength(1);
  });
});

describe('a reading sent late', () => {
  it('keeps the time it was taken beside the time it arrived', async () => {
    const c = await setUp();
    const takenAt = minutesAgo(95);
    const res = await c.crew.agent
      .post(c.readings)
      .send({ position: 1, value: 30, unit: 'lbf-ft', takenAt, expectedTarget: target });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    expect(res.body.reading.takenAt).toBe(takenAt);
    const arrived = Date.parse(res.body.reading.recordedAt);
    expect(Math.abs(arrived - Date.now())).toBeLessThan(60_000);
    // Without a device time, it was taken as it arrived.
    const now = await c.crew.agent
      .post(c.readings)
      .send({ position: 2, value: 30, unit: 'lbf-ft' });
    expect(now.body.reading.takenAt).toBe(now.body.reading.recordedAt);
  });

  it('refuses a time ahead of the server by more than two minutes, and one older than seven days', async () => {
    const c = await setUp();
    const ahead = await c.crew.agent
      .post(c.readings)
      .send({ position: 1, value: 30, unit: 'lbf-ft', takenAt: minutesAgo(-5) });
    expect(ahead.status).toBe(400);
    expect(ahead.body.error.fields.takenAt).toMatch(/ahead of the server/);
    const slightlyAhead = await c.crew.agent
      .post(c.readings)
      .send({ position: 1, value: 30, unit: 'lbf-ft', takenAt: minutesAgo(-1) });
    expect(slightlyAhead.status).toBe(201);
    const old = await c.crew.agent
      .post(c.readings)
      .send({ position: 2, value: 30, unit: 'lbf-ft', takenAt: minutesAgo(7 * 24 * 60 + 5) });
    expect(old.status).toBe(400);
    expect(old.body.error.fields.takenAt).toMatch(/at most 7 days/);
    const bad = await c.crew.agent
      .post(c.readings)
      .send({ position: 2, value: 30, unit: 'lbf-ft', takenAt: 'yesterday' });
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields.takenAt).toBeDefined();
  });

  it('is refused with a clear message when the target changed after it was taken', async () => {
    const c = await setUp();
    await c.owner.agent
      .patch(`${c.base}/fasteners/${c.fastener.id}`)
      .send({ targetValue: 32 })
      .expect(200);
    const res = await c.crew.agent.post(c.readings).send({
      position: 1,
      value: 30,
      unit: 'lbf-ft',
      takenAt: minutesAgo(10),
      expectedTarget: target,
    });
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe('fastener_spec_changed');
    expect(res.body.error.message).toMatch(/Rocker arm bolts changed .*now 32 lbf·ft ± 5 %/);
    expect(await c.count()).toBe(0);
  });

  it('is refused when the step was signed off meanwhile', async () => {
    const c = await setUp();
    await c.owner.agent
      .post(`${c.base}/steps/${c.step.id}/sign-off`)
      .send({ overrideReason: 'Done on paper' })
      .expect(200);
    const res = await c.crew.agent
      .post(c.readings)
      .set('Idempotency-Key', randomUUID())
      .send({
        position: 1,
        value: 30,
        unit: 'lbf-ft',
        takenAt: minutesAgo(10),
        expectedTarget: target,
      });
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe('step_signed_off');
  });

  it('answers 404 once the member has been removed from the build', async () => {
    const c = await setUp();
    // Removed by the owner meanwhile (as the members page does).
    await app.db.knex('build_members').where({ build_id: c.build.id, user_id: c.crew.id }).delete();
    const res = await c.crew.agent
      .post(c.readings)
      .set('Idempotency-Key', randomUUID())
      .send({ position: 1, value: 30, unit: 'lbf-ft' });
    expect(res.status).toBe(404);
  });
});

describe('a queued write names who recorded it', () => {
  it('is refused with 401 and stored nowhere when the session is someone else’s, and taken from the one who recorded it', async () => {
    const c = await setUp();
    const body = { position: 1, value: 30, unit: 'lbf-ft' };
    // Recorded by the crew on this phone; another member has signed in meanwhile.
    const asOwner = await c.owner.agent
      .post(c.readings)
      .set('Idempotency-Key', randomUUID())
      .set('Headroom-Recorded-By', c.crew.id)
      .send(body);
    expect(asOwner.status).toBe(401);
    expect(asOwner.body.error.code).toBe('recorded_by_someone_else');
    expect(await c.count()).toBe(0);

    const asCrew = await c.crew.agent
      .post(c.readings)
      .set('Idempotency-Key', randomUUID())
      .set('Headroom-Recorded-By', c.crew.id)
      .send(body);
    expect(asCrew.status).toBe(201);
    expect(await c.count()).toBe(1);
  });
});
