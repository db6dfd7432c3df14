import { describe, expect, it } from 'vitest';
import { useTestApp } from '../helpers/app';
import {
  addMember,
  buildInput,
  buildWithCast,
  createBuild,
  moneyKeys,
  signUp,
} from '../helpers/factories';

import { findBuildForUser } from '@server/features/builds/builds.repository';
import { stripMoney } from '@server/lib/money-filter';

const app = useTestApp();

describe('POST /api/builds', () => {
  it('creates a build and makes its creator the owner', async () => {
    const owner = await signUp(app, 'owner');
    const res = await owner.agent.post('/api/builds').send(buildInput);
    expect(res.status).toBe(201);
    expect(res.body.build).toMatchObject({ ...buildInput, myRole: 'owner', memberCount: 1 });
    const row = await app.db.knex('build_members').where({ build_id: res.body.build.id }).first();
    expect(row).toMatchObject({ user_id: owner.id, role: 'owner' });
  });

  it('fills optional fields with their defaults', async () => {
    const owner = await signUp(app);
    const res = await owner.agent.post('/api/builds').send({
      name: 'Bare',
      cylinders: 6,
      aspiration: 'single-turbo',
      targetPowerHp: 500,
      targetPowerBasis: 'wheel',
    });
    expect(res.status).toBe(201);
    expect(res.body.build).toMatchObject({
      budgetCents: 0,
      currency: 'USD',
      targetDate: null,
      vehicleYear: null,
      transmission: '',
    });
  });

  it('answers 401 when signed out', async () => {
    const res = await app.agent().post('/api/builds').send(buildInput);
    expect(res.status).toBe(401);
  });
});

describe('GET /api/builds', () => {
  it('lists only my builds, each with my role, money only where I own it', async () => {
    const { owner, crew, stranger, build } = await buildWithCast(app);
    const mine = await owner.agent.get('/api/builds');
    expect(mine.body.builds.map((b: { id: string }) => b.id)).toContain(build.id);
    expect(mine.body.builds.find((b: { id: string }) => b.id === build.id).budgetCents).toBe(
      buildInput.budgetCents,
    );

    const crews = await crew.agent.get('/api/builds');
    const seen = crews.body.builds.find((b: { id: string }) => b.id === build.id);
    expect(seen.myRole).toBe('crew');
    expect(moneyKeys(crews.body)).toEqual([]);

    const strangers = await stranger.agent.get('/api/builds');
    expect(strangers.body.builds).toEqual([]);
  });

  it('shows my money on a build I own beside one where I am crew', async () => {
    const a = await signUp(app, 'a');
    const b = await signUp(app, 'b');
    const own = await createBuild(a, { name: 'Mine', budgetCents: 123_45 });
    const theirs = await createBuild(b, { name: 'Theirs' });
    await addMember(b, theirs.id, a, 'crew');
    const res = await a.agent.get('/api/builds');
    const byId = Object.fromEntries(res.body.builds.map((x: { id: string }) => [x.id, x]));
    expect(byId[own.id].budgetCents).toBe(123_45);
    expect(byId[theirs.id]).not.toHaveProperty('budgetCents');
  });

  it('answers 401 when signed out', async () => {
    expect((await app.agent().get('/api/builds')).status).toBe(401);
  });
});

describe('GET /api/builds/:buildId', () => {
  it('shows the build to every member; money only to the owner', async () => {
    const { owner, crew, shop, viewer, build } = await buildWithCast(app);
    const o = await owner.agent.get(`/api/builds/${build.id}`);
    expect(o.status).toBe(200);
    expect(o.body.build.budgetCents).toBe(buildInput.budgetCents);
    for (const member of [crew, shop, viewer]) {
      const res = await member.agent.get(`/api/builds/${build.id}`);
      expect(res.status).toBe(200);
      expect(res.body.build.name).toBe(buildInput.name);
      expect(moneyKeys(res.body)).toEqual([]);
    }
  });

  it('answers 404 to a stranger, for a missing build and for a malformed id', async () => {
    const { stranger, build } = await buildWithCast(app);
    expect((await stranger.agent.get(`/api/builds/${build.id}`)).status).toBe(404);
    expect(
      (await stranger.agent.get('/api/builds/00000000-0000-4000-8000-000000000000')).status,
    ).toBe(404);
    expect((await stranger.agent.get('/api/builds/not-an-id')).status).toBe(404);
  });

  it('answers 401 when signed out, whether or not the build exists', async () => {
    const { build } = await buildWithCast(app);
    expect((await app.agent().get(`/api/builds/${build.id}`)).status).toBe(401);
  });

  it('reads the build from the row that came with the session exactly as from its own query', async () => {
    const { owner, crew, build } = await buildWithCast(app);
    // Every kind of column: text, numeric, a date, money, timestamps with microseconds.
    await owner.agent.patch(`/api/builds/${build.id}`).send({
      displacementLiters: 6.65,
      targetDate: '2027-05-01',
      targetTorqueLbft: 1450.5,
      budgetCents: 1_234_567_89,
    });
    const direct = (userId: string) => findBuildForUser(app.db.knex, build.id, userId);
    const o = await owner.agent.get(`/api/builds/${build.id}`);
    expect(o.body.build).toEqual(await direct(owner.id));
    const c = await crew.agent.get(`/api/builds/${build.id}`);
    expect(c.body.build).toEqual(stripMoney(await direct(crew.id)));
  });
});

describe('PATCH /api/builds/:buildId', () => {
  it('lets the owner change fields and leaves the others alone', async () => {
    const { owner, build } = await buildWithCast(app);
    const res = await owner.agent
      .patch(`/api/builds/${build.id}`)
      .send({ targetPowerHp: 720, targetEvent: 'Fall pull' });
    expect(res.status).toBe(200);
    expect(res.body.build).toMatchObject({
      targetPowerHp: 720,
      targetEvent: 'Fall pull',
      name: buildInput.name,
      budgetCents: buildInput.budgetCents,
    });
  });

  it('refuses crew, shop and viewer with 403 and a stranger with 404', async () => {
    const { crew, shop, viewer, stranger, build } = await buildWithCast(app);
    for (const m of [crew, shop, viewer]) {
      const res = await m.agent.patch(`/api/builds/${build.id}`).send({ name: 'Hijacked' });
      expect(res.status).toBe(403);
      expect(moneyKeys(res.body)).toEqual([]);
    }
    expect((await stranger.agent.patch(`/api/builds/${build.id}`).send({ name: 'x' })).status).toBe(
      404,
    );
    expect((await app.agent().patch(`/api/builds/${build.id}`).send({ name: 'x' })).status).toBe(
      401,
    );
    const row = await app.db.knex('builds').where({ id: build.id }).first();
    expect(row.name).toBe(buildInput.name);
  });

  it('refuses an empty change and unknown fields', async () => {
    const { owner, build } = await buildWithCast(app);
    expect((await owner.agent.patch(`/api/builds/${build.id}`).send({})).status).toBe(400);
    const res = await owner.agent.patch(`/api/builds/${build.id}`).send({ horsepower: 9000 });
    expect(res.status).toBe(400);
    expect(res.body.error.fields.horsepower).toBe('Unknown field');
  });
});

describe('DELETE /api/builds/:buildId', () => {
  it('lets only the owner delete, and then the build is gone for everyone', async () => {
    const { owner, crew, shop, viewer, stranger, build } = await buildWithCast(app);
    for (const m of [crew, shop, viewer])
      expect((await m.agent.delete(`/api/builds/${build.id}`)).status).toBe(403);
    expect((await stranger.agent.delete(`/api/builds/${build.id}`)).status).toBe(404);
    expect((await app.agent().delete(`/api/builds/${build.id}`)).status).toBe(401);
    expect((await owner.agent.delete(`/api/builds/${build.id}`)).status).toBe(204);
    expect((await owner.agent.get(`/api/builds/${build.id}`)).status).toBe(404);
    expect((await crew.agent.get(`/api/builds/${build.id}`)).status).toBe(404);
    expect(await app.db.knex('build_members').where({ build_id: build.id })).toEqual([]);
  });
});
