import { describe, expect, it } from 'vitest';
import { hashToken } from '@server/lib/tokens';
import { useTestApp } from '../helpers/app';
import {
  addMember,
  buildWithCast,
  password,
  signUp,
  uniqueEmail,
  type TestUser,
} from '../helpers/factories';
import { tokenFrom } from '../helpers/mail';

const app = useTestApp({}, { mail: true });

async function invite(owner: TestUser, buildId: string, email: string, role = 'crew') {
  const res = await owner.agent.post(`/api/builds/${buildId}/invitations`).send({ email, role });
  expect(res.status, JSON.stringify(res.body)).toBe(201);
  return res.body.invitation as {
    id: string;
    email: string;
    role: string;
    status: string;
    expiresAt: string;
  };
}

/** Delivers the queued mail and returns the newest invitation mail's token for `email`. */
async function inviteToken(email: string) {
  await app.mail.deliver();
  const mails = (await app.mail.to(email)).filter((m) => m.subject?.includes('invited to a build'));
  expect(mails.length).toBeGreaterThan(0);
  return tokenFrom(mails.at(-1)!, '/invite/');
}

describe('inviting by e-mail', () => {
  it('mails the invitee a link in Headroom’s look, with a text and an HTML part and no secret but the link', async () => {
    const { owner, build } = await buildWithCast(app);
    const email = uniqueEmail('invitee');
    const invitation = await invite(owner, build.id, email, 'crew');
    expect(invitation).toMatchObject({
      email,
      role: 'crew',
      status: 'pending',
      invitedBy: owner.displayName,
    });
    expect(JSON.stringify(invitation)).not.toMatch(/token/i);

    // Nothing is sent by the request itself: it waits in the outbox.
    expect(await app.mail.to(email)).toEqual([]);
    const pass = await app.mail.deliver();
    expect(pass.sent).toBeGreaterThanOrEqual(1);

    const [mail] = await app.mail.to(email);
    // No user-written text in the subject; the build's name is in the body, quoted.
    expect(mail.subject).toBe('You are invited to a build on Headroom');
    expect(mail.textBody).toContain('“Test hauler”');
    expect(mail.textBody).toMatch(/as crew/);
    expect(mail.textBody).toContain(`${app.origin}/invite/`);
    const html = String(mail.html);
    expect(html).toContain('#1b2230');
    expect(html).toContain('#d9622b');
    expect(html).toContain('>Headroom<');
    const token = tokenFrom(mail, '/invite/');
    expect(token).toMatch(/^[A-Za-z0-9_-]{43}$/);
    expect(html).toContain(`${app.origin}/invite/${token}`);

    // The database keeps only the token's hash, and the outbox forgets the link once sent.
    const row = await app.db.knex('build_invitations').where({ id: invitation.id }).first();
    expect(row.token_hash).toBe(hashToken(token));
    const outbox = await app.db.knex('mail_outbox').where({ to_address: email });
    expect(outbox).toHaveLength(1);
    expect(outbox[0]).toMatchObject({
      status: 'sent',
      attempts: 1,
      action_path: null,
      body_text: '',
    });
    expect(JSON.stringify(outbox)).not.toContain(token);
  });

  it('shows the link’s page: build, role, inviter and whether the address has an account', async () => {
    const { owner, build } = await buildWithCast(app);
    const fresh = uniqueEmail('fresh');
    const known = await signUp(app, 'known');
    await invite(owner, build.id, fresh, 'viewer');
    await invite(owner, build.id, known.email, 'shop');
    const freshRes = await app.agent().get(`/api/invitations/${await inviteToken(fresh)}`);
    expect(freshRes.status).toBe(200);
    expect(freshRes.body.invitation).toMatchObject({
      buildId: build.id,
      buildName: 'Test hauler',
      role: 'viewer',
      email: fresh,
      inviterName: owner.displayName,
      accountExists: false,
    });
    const knownRes = await app.agent().get(`/api/invitations/${await inviteToken(known.email)}`);
    expect(knownRes.body.invitation).toMatchObject({ role: 'shop', accountExists: true });
  });

  it('refuses to invite someone already on the build, and a second open invitation to the same address', async () => {
    const { owner, crew, build } = await buildWithCast(app);
    const member = await owner.agent
      .post(`/api/builds/${build.id}/invitations`)
      .send({ email: crew.email, role: 'viewer' });
    expect(member.status).toBe(409);
    expect(member.body.error.code).toBe('already_member');
    const email = uniqueEmail('twice');
    await invite(owner, build.id, email);
    const again = await owner.agent
      .post(`/api/builds/${build.id}/invitations`)
      .send({ email: email.toUpperCase(), role: 'viewer' });
    expect(again.status).toBe(409);
    expect(again.body.error.code).toBe('already_invited');
    expect(again.body.error.fields.email).toMatch(/resend/i);
  });

  it('refuses a bad address and an unknown role with field messages', async () => {
    const { owner, build } = await buildWithCast(app);
    const res = await owner.agent
      .post(`/api/builds/${build.id}/invitations`)
      .send({ email: 'not-an-address', role: 'boss' });
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields).sort()).toEqual(['email', 'role']);
  });
});

describe('accepting an invitation', () => {
  it('lets a new person create the account with the link, signs them in and puts them on the build with the role', async () => {
    const { owner, build } = await buildWithCast(app);
    const email = uniqueEmail('newcrew');
    await invite(owner, build.id, email, 'crew');
    const token = await inviteToken(email);

    const agent = app.agent();
    const res = await agent
      .post(`/api/invitations/${token}/accept`)
      .send({ password, displayName: ' New Crew ' });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    expect(res.body).toMatchObject({
      user: { email, displayName: 'New Crew' },
      build: { id: build.id, name: 'Test hauler' },
      role: 'crew',
      joined: true,
      accountCreated: true,
    });
    expect(String(res.headers['set-cookie'])).toMatch(/headroom_session=/);
    expect((await agent.get('/api/me')).body.user.email).toBe(email);
    expect((await agent.get(`/api/builds/${build.id}`)).body.build.myRole).toBe('crew');
    // The new account signs in with the password it chose.
    expect((await app.agent().post('/api/auth/sign-in').send({ email, password })).status).toBe(
      200,
    );
    // The owner's list no longer shows it as open.
    expect((await owner.agent.get(`/api/builds/${build.id}/invitations`)).body.invitations).toEqual(
      [],
    );
  });

  it('lets an existing user accept while signed in', async () => {
    const { owner, build } = await buildWithCast(app);
    const friend = await signUp(app, 'friend');
    await invite(owner, build.id, friend.email, 'viewer');
    const token = await inviteToken(friend.email);
    const res = await friend.agent.post(`/api/invitations/${token}/accept`).send({});
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({
      user: { id: friend.id },
      role: 'viewer',
      joined: true,
      accountCreated: false,
    });
    expect((await friend.agent.get(`/api/builds/${build.id}`)).body.build.myRole).toBe('viewer');
  });

  it('asks a signed-out person to sign in when the address has an account, and will not create a second one', async () => {
    const { owner, build } = await buildWithCast(app);
    const friend = await signUp(app, 'hasacct');
    await invite(owner, build.id, friend.email);
    const token = await inviteToken(friend.email);
    const bare = await app.agent().post(`/api/invitations/${token}/accept`).send({});
    expect(bare.status).toBe(401);
    expect(bare.body.error.code).toBe('sign_in_to_accept');
    const create = await app
      .agent()
      .post(`/api/invitations/${token}/accept`)
      .send({ password, displayName: 'Impostor' });
    expect(create.status).toBe(409);
    expect(create.body.error.code).toBe('email_taken');
    // The link still works for the right person.
    expect((await friend.agent.post(`/api/invitations/${token}/accept`).send({})).status).toBe(200);
  });

  it('refuses a signed-in account whose e-mail is not the invited one (a forwarded link)', async () => {
    const { owner, build, stranger } = await buildWithCast(app);
    const email = uniqueEmail('intended');
    await invite(owner, build.id, email);
    const token = await inviteToken(email);
    const res = await stranger.agent.post(`/api/invitations/${token}/accept`).send({});
    expect(res.status).toBe(403);
    expect(res.body.error.code).toBe('invitation_other_account');
    expect(res.body.error.message).toContain(email);
    expect((await stranger.agent.get(`/api/builds/${build.id}`)).status).toBe(404);
  });

  it('keeps the role of someone who is already a member when they accept', async () => {
    const { owner, build } = await buildWithCast(app);
    const friend = await signUp(app, 'already');
    await invite(owner, build.id, friend.email, 'viewer');
    const token = await inviteToken(friend.email);
    await addMember(owner, build.id, friend, 'crew');
    const res = await friend.agent.post(`/api/invitations/${token}/accept`).send({});
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ role: 'crew', joined: false });
  });

  it('refuses a half-filled sign-up', async () => {
    const { owner, build } = await buildWithCast(app);
    const email = uniqueEmail('half');
    await invite(owner, build.id, email);
    const token = await inviteToken(email);
    const res = await app.agent().post(`/api/invitations/${token}/accept`).send({ password });
    expect(res.status).toBe(400);
    expect(res.body.error.fields.displayName).toBeTruthy();
    const short = await app
      .agent()
      .post(`/api/invitations/${token}/accept`)
      .send({ password: 'short', displayName: 'A' });
    expect(short.status).toBe(400);
    expect(short.body.error.fields.password).toBeTruthy();
  });
});

describe('links that no longer work', () => {
  it('refuses a used link, on the page and on accept', async () => {
    const { owner, build } = await buildWithCast(app);
    const email = uniqueEmail('once');
    await invite(owner, build.id, email);
    const token = await inviteToken(email);
    expect(
      (
        await app
          .agent()
          .post(`/api/invitations/${token}/accept`)
          .send({ password, displayName: 'Once' })
      ).status,
    ).toBe(201);
    const page = await app.agent().get(`/api/invitations/${token}`);
    expect(page.status).toBe(404);
    expect(page.body.error.code).toBe('invitation_used');
    const again = await app
      .agent()
      .post(`/api/invitations/${token}/accept`)
      .send({ password, displayName: 'Twice' });
    expect(again.status).toBe(404);
    expect(again.body.error.code).toBe('invitation_used');
  });

  it('uses a link only once even when it is accepted twice at the same moment', async () => {
    const { owner, build } = await buildWithCast(app);
    const friend = await signUp(app, 'race');
    await invite(owner, build.id, friend.email);
    const token = await inviteToken(friend.email);
    const [a, b] = await Promise.all([
      friend.agent.post(`/api/invitations/${token}/accept`).send({}),
      friend.agent.post(`/api/invitations/${token}/accept`).send({}),
    ]);
    expect([a.status, b.status].sort()).toEqual([200, 404]);
  });

  it('refuses an expired link', async () => {
    const { owner, build } = await buildWithCast(app);
    const email = uniqueEmail('late');
    const inv = await invite(owner, build.id, email);
    const token = await inviteToken(email);
    expect(new Date(inv.expiresAt).getTime() - Date.now()).toBeGreaterThan(
      7 * 24 * 3600_000 - 60_000,
    );
    // Eight days later, as far as the database is concerned.
    await app.db
      .knex('build_invitations')
      .where({ id: inv.id })
      .update({ expires_at: new Date(Date.now() - 24 * 3600_000) });
    const page = await app.agent().get(`/api/invitations/${token}`);
    expect(page.status).toBe(404);
    expect(page.body.error.code).toBe('invitation_expired');
    const accept = await app
      .agent()
      .post(`/api/invitations/${token}/accept`)
      .send({ password, displayName: 'Late' });
    expect(accept.status).toBe(404);
    expect(accept.body.error.code).toBe('invitation_expired');
    expect(await app.db.knex('users').where({ email })).toEqual([]);
    // The owner sees it as expired and can still resend or revoke it.
    const list = await owner.agent.get(`/api/builds/${build.id}/invitations`);
    expect(list.body.invitations).toMatchObject([{ id: inv.id, status: 'expired' }]);
  });

  it('refuses a revoked link', async () => {
    const { owner, build } = await buildWithCast(app);
    const email = uniqueEmail('revoked');
    const inv = await invite(owner, build.id, email);
    const token = await inviteToken(email);
    expect((await owner.agent.delete(`/api/builds/${build.id}/invitations/${inv.id}`)).status).toBe(
      204,
    );
    const page = await app.agent().get(`/api/invitations/${token}`);
    expect(page.status).toBe(404);
    expect(page.body.error.code).toBe('invitation_revoked');
    const accept = await app
      .agent()
      .post(`/api/invitations/${token}/accept`)
      .send({ password, displayName: 'Nope' });
    expect(accept.body.error.code).toBe('invitation_revoked');
    expect((await owner.agent.get(`/api/builds/${build.id}/invitations`)).body.invitations).toEqual(
      [],
    );
    expect((await owner.agent.delete(`/api/builds/${build.id}/invitations/${inv.id}`)).status).toBe(
      404,
    );
    // Revoked, the address can be invited again.
    await invite(owner, build.id, email, 'viewer');
  });

  it('refuses unknown and malformed tokens with 404', async () => {
    for (const token of ['x', 'A'.repeat(43), 'A'.repeat(200)]) {
      const res = await app.agent().get(`/api/invitations/${token}`);
      expect(res.status).toBe(404);
      expect(res.body.error.code).toBe('invitation_not_found');
    }
  });
});

describe('pending invitations: list, resend, revoke', () => {
  it('lists open invitations newest first with who sent them', async () => {
    const { owner, build } = await buildWithCast(app);
    const a = await invite(owner, build.id, uniqueEmail('a'), 'crew');
    const b = await invite(owner, build.id, uniqueEmail('b'), 'shop');
    const res = await owner.agent.get(`/api/builds/${build.id}/invitations`);
    expect(res.status).toBe(200);
    expect(res.body.invitations.map((i: { id: string }) => i.id)).toEqual([b.id, a.id]);
    expect(res.body.invitations[0]).toMatchObject({
      role: 'shop',
      status: 'pending',
      invitedBy: owner.displayName,
      sendCount: 1,
    });
  });

  it('resends with a new link; the old link stops working', async () => {
    const { owner, build } = await buildWithCast(app);
    const email = uniqueEmail('resend');
    const inv = await invite(owner, build.id, email);
    const first = await inviteToken(email);
    const res = await owner.agent.post(`/api/builds/${build.id}/invitations/${inv.id}/resend`);
    expect(res.status).toBe(200);
    expect(res.body.invitation).toMatchObject({ id: inv.id, sendCount: 2, status: 'pending' });
    const second = await inviteToken(email);
    expect(second).not.toBe(first);
    expect((await app.mail.to(email)).length).toBe(2);
    expect((await app.agent().get(`/api/invitations/${first}`)).body.error.code).toBe(
      'invitation_not_found',
    );
    expect((await app.agent().get(`/api/invitations/${second}`)).status).toBe(200);
  });

  it('answers 404 for an invitation of another build and a malformed id', async () => {
    const one = await buildWithCast(app);
    const two = await buildWithCast(app);
    const inv = await invite(two.owner, two.build.id, uniqueEmail('other'));
    expect(
      (await one.owner.agent.post(`/api/builds/${one.build.id}/invitations/${inv.id}/resend`))
        .status,
    ).toBe(404);
    expect(
      (await one.owner.agent.delete(`/api/builds/${one.build.id}/invitations/${inv.id}`)).status,
    ).toBe(404);
    expect(
      (await one.owner.agent.delete(`/api/builds/${one.build.id}/invitations/nope`)).status,
    ).toBe(404);
  });

  it('lets only the owner use every invitation route: 403 for crew, shop and viewer, 404 for a stranger, 401 signed out', async () => {
    const { owner, crew, shop, viewer, stranger, build } = await buildWithCast(app);
    const inv = await invite(owner, build.id, uniqueEmail('guarded'));
    const base = `/api/builds/${build.id}/invitations`;
    const routes = [
      (a: ReturnType<typeof app.agent>) => a.get(base),
      (a: ReturnType<typeof app.agent>) =>
        a.post(base).send({ email: uniqueEmail('x'), role: 'crew' }),
      (a: ReturnType<typeof app.agent>) => a.post(`${base}/${inv.id}/resend`),
      (a: ReturnType<typeof app.agent>) => a.delete(`${base}/${inv.id}`),
    ];
    for (const route of routes) {
      for (const m of [crew, shop, viewer]) expect((await route(m.agent)).status).toBe(403);
      expect((await route(stranger.agent)).status).toBe(404);
      expect((await route(app.agent())).status).toBe(401);
    }
    const still = await owner.agent.get(base);
    expect(still.body.invitations).toMatchObject([{ id: inv.id, sendCount: 1 }]);
  });
});
