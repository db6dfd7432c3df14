import { describe, expect, it } from 'vitest';
import { useTestApp } from '../helpers/app';
import { password, signUp, uniqueEmail } from '../helpers/factories';

const app = useTestApp();

describe('sign-up', () => {
  it('creates an account, starts a session with a safe cookie and answers /api/me', async () => {
    const agent = app.agent();
    const email = uniqueEmail('new');
    const res = await agent
      .post('/api/auth/sign-up')
      .send({ email, password, displayName: '  Ada Welder ' });
    expect(res.status).toBe(201);
    expect(res.body.user).toMatchObject({ email, displayName: 'Ada Welder' });
    expect(res.body.user).not.toHaveProperty('passwordHash');
    const cookie = String(res.headers['set-cookie']);
    expect(cookie).toMatch(/headroom_session=/);
    expect(cookie).toMatch(/HttpOnly/i);
    expect(cookie).toMatch(/SameSite=Lax/i);
    expect(cookie).not.toMatch(/Secure/i); // plain http on loopback
    const me = await agent.get('/api/me');
    expect(me.status).toBe(200);
    expect(me.body.user.email).toBe(email);
  });

  it('trims and lower-cases the e-mail and refuses a second account with it', async () => {
    const email = uniqueEmail('case');
    const first = await app
      .agent()
      .post('/api/auth/sign-up')
      .send({ email: `  ${email.toUpperCase()} `, password, displayName: 'A' });
    expect(first.status).toBe(201);
    expect(first.body.user.email).toBe(email);
    const again = await app
      .agent()
      .post('/api/auth/sign-up')
      .send({ email, password, displayName: 'B' });
    expect(again.status).toBe(409);
    expect(again.body.error.code).toBe('email_taken');
    expect(again.body.error.fields.email).toBeTruthy();
  });

  it('refuses passwords shorter than 10 or longer than 256 characters', async () => {
    for (const pw of ['short', 'x'.repeat(257)]) {
      const res = await app
        .agent()
        .post('/api/auth/sign-up')
        .send({ email: uniqueEmail(), password: pw, displayName: 'A' });
      expect(res.status).toBe(400);
      expect(res.body.error.fields.password).toBeTruthy();
    }
    const edge = await app
      .agent()
      .post('/api/auth/sign-up')
      .send({ email: uniqueEmail(), password: 'x'.repeat(256), displayName: 'A' });
    expect(edge.status).toBe(201);
  });

  it('stores an argon2id hash, never the password', async () => {
    const user = await signUp(app, 'hash');
    const row = await app.db.knex('users').where({ id: user.id }).first();
    expect(row.password_hash).toMatch(/^\$argon2id\$/);
    expect(row.password_hash).not.toContain(password);
  });
});

describe('sign-in and sign-out', () => {
  it('signs in with the right password, case-insensitive e-mail', async () => {
    const user = await signUp(app, 'signin');
    const agent = app.agent();
    const res = await agent
      .post('/api/auth/sign-in')
      .send({ email: user.email.toUpperCase(), password });
    expect(res.status).toBe(200);
    expect(res.body.user.id).toBe(user.id);
    expect((await agent.get('/api/me')).status).toBe(200);
  });

  it('gives the same answer for a wrong password and an unknown e-mail', async () => {
    const user = await signUp(app, 'wrong');
    const wrongPw = await app
      .agent()
      .post('/api/auth/sign-in')
      .send({ email: user.email, password: 'not-the-password' });
    const unknown = await app
      .agent()
      .post('/api/auth/sign-in')
      .send({ email: uniqueEmail('nobody'), password });
    expect(wrongPw.status).toBe(401);
    expect(unknown.status).toBe(401);
    expect(wrongPw.body).toEqual(unknown.body);
  });

  it('ends the session on the server: the old cookie no longer works', async () => {
    const user = await signUp(app, 'out');
    const cookie = (await user.agent.get('/api/me')).request.cookies;
    const res = await user.agent.post('/api/auth/sign-out');
    expect(res.status).toBe(204);
    expect((await user.agent.get('/api/me')).status).toBe(401);
    // Replaying the old cookie by hand must fail too: the session row is gone.
    const replay = await app.bare().get('/api/me').set('Cookie', cookie);
    expect(replay.status).toBe(401);
  });

  it('answers 401 to /api/me and sign-out when signed out', async () => {
    expect((await app.agent().get('/api/me')).status).toBe(401);
    expect((await app.agent().post('/api/auth/sign-out')).status).toBe(401);
  });
});

describe('origin check', () => {
  it('refuses a state-changing request with no Origin header', async () => {
    const res = await app
      .bare()
      .post('/api/auth/sign-up')
      .send({ email: uniqueEmail(), password, displayName: 'A' });
    expect(res.status).toBe(403);
    expect(res.body.error.code).toBe('bad_origin');
  });

  it('refuses a state-changing request from another origin', async () => {
    const res = await app
      .bare()
      .post('/api/auth/sign-in')
      .set('Origin', 'https://evil.example.test')
      .send({ email: uniqueEmail(), password });
    expect(res.status).toBe(403);
  });

  it('lets reads through without an Origin header', async () => {
    const res = await app.bare().get('/api/health');
    expect(res.status).toBe(200);
    expect(res.body).toEqual({ ok: true });
  });
});
