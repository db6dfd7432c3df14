import { describe, expect, it } from 'vitest';
import { useTestApp } from '../helpers/app';
import { buildWithCast, moneyKeys, signUp, uniqueEmail } from '../helpers/factories';

const app = useTestApp();

describe('GET /api/builds/:buildId/members', () => {
  it('lists members with roles; e-mails only for the owner', async () => {
    const { owner, crew, shop, viewer, build } = await buildWithCast(app);
    const o = await owner.agent.get(`/api/builds/${build.id}/members`);
    expect(o.status).toBe(200);
    expect(o.body.members.map((m: { role: string }) => m.role)).toEqual([
      'owner',
      'crew',
      'shop',
      'viewer',
    ]);
    expect(o.body.members.every((m: { email?: string }) => typeof m.email === 'string')).toBe(true);
    for (const m of [crew, shop, viewer]) {
      const res = await m.agent.get(`/api/builds/${build.id}/members`);
      expect(res.status).toBe(200);
      expect(res.body.members).toHaveLength(4);
      expect(res.body.members.some((x: { email?: string }) => x.email)).toBe(false);
      expect(moneyKeys(res.body)).toEqual([]);
    }
  });

  it('answers 404 to a stranger and 401 when signed out', async () => {
    const { stranger, build } = await buildWithCast(app);
    expect((await stranger.agent.get(`/api/builds/${build.id}/members`)).status).toBe(404);
    expect((await app.agent().get(`/api/builds/${build.id}/members`)).status).toBe(401);
  });
});

describe('adding people', () => {
  it('has one way in, an invitation by e-mail, which does not tell whether an address has an account', async () => {
    const { owner, build } = await buildWithCast(app);
    const friend = await signUp(app, 'friend');
    const ghost = uniqueEmail('ghost');
    // No route adds an existing account by its address (it would answer differently for one).
    for (const email of [friend.email, ghost]) {
      const res = await owner.agent
        .post(`/api/builds/${build.id}/members`)
        .send({ email, role: 'crew' });
      expect(res.status).toBe(404);
    }
    const invite = (email: string) =>
      owner.agent.post(`/api/builds/${build.id}/invitations`).send({ email, role: 'crew' });
    const a = await invite(friend.email);
    const b = await invite(ghost);
    expect([a.status, b.status]).toEqual([201, 201]);
    expect(Object.keys(a.body.invitation).sort()).toEqual(Object.keys(b.body.invitation).sort());
    const strip = (i: Record<string, unknown>) => ({
      ...i,
      id: '',
      email: '',
      createdAt: '',
      lastSentAt: '',
      expiresAt: '',
    });
    expect(strip(a.body.invitation)).toEqual(strip(b.body.invitation));
    expect(
      await app.db.knex('build_members').where({ build_id: build.id, user_id: friend.id }),
    ).toEqual([]);
  });
});

describe('PATCH and DELETE /api/builds/:buildId/members/:userId', () => {
  it('lets the owner change a role and remove a member', async () => {
    const { owner, crew, build } = await buildWithCast(app);
    const res = await owner.agent
      .patch(`/api/builds/${build.id}/members/${crew.id}`)
      .send({ role: 'shop' });
    expect(res.status).toBe(200);
    expect(res.body.member.role).toBe('shop');
    expect((await owner.agent.delete(`/api/builds/${build.id}/members/${crew.id}`)).status).toBe(
      204,
    );
    expect((await crew.agent.get(`/api/builds/${build.id}`)).status).toBe(404);
  });

  it('never leaves a build without an owner', async () => {
    const { owner, crew, build } = await buildWithCast(app);
    const demote = await owner.agent
      .patch(`/api/builds/${build.id}/members/${owner.id}`)
      .send({ role: 'crew' });
    expect(demote.status).toBe(409);
    expect(demote.body.error.code).toBe('last_owner');
    expect((await owner.agent.delete(`/api/builds/${build.id}/members/${owner.id}`)).status).toBe(
      409,
    );
    // With a second owner, the first may step down.
    await owner.agent.patch(`/api/builds/${build.id}/members/${crew.id}`).send({ role: 'owner' });
    expect(
      (
        await owner.agent
          .patch(`/api/builds/${build.id}/members/${owner.id}`)
          .send({ role: 'viewer' })
      ).status,
    ).toBe(200);
    const owners = await app.db.knex('build_members').where({ build_id: build.id, role: 'owner' });
    expect(owners.map((o: { user_id: string }) => o.user_id)).toEqual([crew.id]);
  });

  it('keeps one owner when two owners demote each other at the same moment', async () => {
    const { owner, crew, build } = await buildWithCast(app);
    await owner.agent.patch(`/api/builds/${build.id}/members/${crew.id}`).send({ role: 'owner' });
    const [a, b] = await Promise.all([
      owner.agent.patch(`/api/builds/${build.id}/members/${crew.id}`).send({ role: 'crew' }),
      crew.agent.patch(`/api/builds/${build.id}/members/${owner.id}`).send({ role: 'crew' }),
    ]);
    // One succeeds. The other is refused: 409 when it reached the owner lock second,
    // or 403 when its caller had already been demoted before its access check.
    expect([a.status, b.status].filter((s) => s === 200)).toHaveLength(1);
    expect([a.status, b.status].filter((s) => s !== 200)[0]).toBeOneOf([403, 409]);
    const owners = await app.db.knex('build_members').where({ build_id: build.id, role: 'owner' });
    expect(owners).toHaveLength(1);
  });

  it('answers 404 for someone who is not a member and for a malformed id', async () => {
    const { owner, build } = await buildWithCast(app);
    const outsider = await signUp(app);
    expect(
      (
        await owner.agent
          .patch(`/api/builds/${build.id}/members/${outsider.id}`)
          .send({ role: 'crew' })
      ).status,
    ).toBe(404);
    expect((await owner.agent.delete(`/api/builds/${build.id}/members/nope`)).status).toBe(404);
  });

  it('refuses crew, shop and viewer with 403, a stranger with 404, signed out with 401', async () => {
    const { crew, shop, viewer, stranger, build, owner } = await buildWithCast(app);
    for (const m of [crew, shop, viewer]) {
      expect(
        (
          await m.agent
            .patch(`/api/builds/${build.id}/members/${viewer.id}`)
            .send({ role: 'owner' })
        ).status,
      ).toBe(403);
      expect((await m.agent.delete(`/api/builds/${build.id}/members/${owner.id}`)).status).toBe(
        403,
      );
    }
    expect(
      (
        await stranger.agent
          .patch(`/api/builds/${build.id}/members/${viewer.id}`)
          .send({ role: 'owner' })
      ).status,
    ).toBe(404);
    expect(
      (await stranger.agent.delete(`/api/builds/${build.id}/members/${viewer.id}`)).status,
    ).toBe(404);
    expect((await app.agent().delete(`/api/builds/${build.id}/members/${viewer.id}`)).status).toBe(
      401,
    );
    expect((await app.db.knex('build_members').where({ build_id: build.id })).length).toBe(4);
  });
});
