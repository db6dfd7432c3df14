import { describe, expect, it } from 'vitest';
import { useTestApp } from '../helpers/app';
import { password, signUp, uniqueEmail } from '../helpers/factories';
import { tokenFrom } from '../helpers/mail';

const app = useTestApp({}, { mail: true });
const newPassword = 'a-brand-new-passphrase';

async function requestReset(email: string) {
  const res = await app.agent().post('/api/auth/password-reset').send({ email });
  expect(res.status).toBe(202);
  return res;
}

async function resetToken(email: string) {
  await app.mail.deliver();
  const mails = (await app.mail.to(email)).filter(
    (m) => m.subject === 'Set a new Headroom password',
  );
  expect(mails.length).toBeGreaterThan(0);
  return tokenFrom(mails.at(-1)!, '/reset-password/');
}

describe('asking for a reset', () => {
  it('answers a known and an unknown address the same, and mails only the known one', async () => {
    const user = await signUp(app, 'known');
    const unknown = uniqueEmail('unknown');
    const a = await requestReset(user.email);
    const b = await requestReset(unknown);
    expect(a.body).toEqual(b.body);
    expect(a.body.message).toMatch(/if a headroom account uses that e-mail/i);
    await app.mail.deliver();
    expect(await app.mail.to(unknown)).toEqual([]);
    const [mail] = await app.mail.to(user.email);
    expect(mail.subject).toBe('Set a new Headroom password');
    expect(mail.textBody).toContain(`${app.origin}/reset-password/`);
    expect(String(mail.html)).toContain('#d9622b');
    expect(await app.db.knex('password_resets').where({ user_id: user.id })).toHaveLength(1);
  });

  it('sends at most three reset mails an hour to one address, still answering the same', async () => {
    const user = await signUp(app, 'bombed');
    for (let i = 0; i < 5; i++) await requestReset(user.email.toUpperCase());
    await app.mail.deliver();
    expect(await app.mail.to(user.email)).toHaveLength(3);
  });

  it('refuses something that is not an e-mail address', async () => {
    const res = await app.agent().post('/api/auth/password-reset').send({ email: 'nope' });
    expect(res.status).toBe(400);
    expect(res.body.error.fields.email).toBeTruthy();
  });
});

describe('setting the new password', () => {
  it('sets it, ends every other session, signs this browser in and tells the owner of the address', async () => {
    const user = await signUp(app, 'reset');
    const laptop = app.agent();
    expect(
      (await laptop.post('/api/auth/sign-in').send({ email: user.email, password })).status,
    ).toBe(200);
    await requestReset(user.email);
    const token = await resetToken(user.email);

    const check = await app.agent().get(`/api/auth/password-reset/${token}`);
    expect(check.status).toBe(200);
    expect(check.body.reset.email).toBe(user.email);
    expect(new Date(check.body.reset.expiresAt).getTime() - Date.now()).toBeLessThanOrEqual(
      3600_000,
    );

    const browser = app.agent();
    const res = await browser
      .post(`/api/auth/password-reset/${token}`)
      .send({ password: newPassword });
    expect(res.status).toBe(200);
    expect(res.body.user).toMatchObject({ id: user.id, email: user.email });
    expect((await browser.get('/api/me')).status).toBe(200);
    // Both sessions that existed before the reset are gone.
    expect((await user.agent.get('/api/me')).status).toBe(401);
    expect((await laptop.get('/api/me')).status).toBe(401);
    const row = await app.db.knex('users').where({ id: user.id }).first();
    expect(row.password_hash).toMatch(/^\$argon2id\$/);
    expect(
      (await app.agent().post('/api/auth/sign-in').send({ email: user.email, password })).status,
    ).toBe(401);
    expect(
      (
        await app
          .agent()
          .post('/api/auth/sign-in')
          .send({ email: user.email, password: newPassword })
      ).status,
    ).toBe(200);

    await app.mail.deliver();
    const changed = (await app.mail.to(user.email)).filter(
      (m) => m.subject === 'Your Headroom password was changed',
    );
    expect(changed).toHaveLength(1);
    expect(changed[0].textBody).not.toMatch(/reset-password\//);
  });

  it('uses a link once', async () => {
    const user = await signUp(app, 'once');
    await requestReset(user.email);
    const token = await resetToken(user.email);
    expect(
      (await app.agent().post(`/api/auth/password-reset/${token}`).send({ password: newPassword }))
        .status,
    ).toBe(200);
    const again = await app
      .agent()
      .post(`/api/auth/password-reset/${token}`)
      .send({ password: 'yet-another-passphrase' });
    expect(again.status).toBe(404);
    expect(again.body.error.code).toBe('reset_used');
    expect((await app.agent().get(`/api/auth/password-reset/${token}`)).body.error.code).toBe(
      'reset_used',
    );
    expect(
      (
        await app
          .agent()
          .post('/api/auth/sign-in')
          .send({ email: user.email, password: newPassword })
      ).status,
    ).toBe(200);
  });

  it('refuses a link older than an hour', async () => {
    const user = await signUp(app, 'late');
    await requestReset(user.email);
    const token = await resetToken(user.email);
    await app.db
      .knex('password_resets')
      .where({ user_id: user.id })
      .update({ expires_at: new Date(Date.now() - 60_000) });
    const res = await app
      .agent()
      .post(`/api/auth/password-reset/${token}`)
      .send({ password: newPassword });
    expect(res.status).toBe(404);
    expect(res.body.error.code).toBe('reset_expired');
    expect((await user.agent.get('/api/me')).status).toBe(200);
    expect(
      (await app.agent().post('/api/auth/sign-in').send({ email: user.email, password })).status,
    ).toBe(200);
  });

  it('lets only the newest link work when several were asked for', async () => {
    const user = await signUp(app, 'newest');
    await requestReset(user.email);
    const first = await resetToken(user.email);
    await requestReset(user.email);
    const second = await resetToken(user.email);
    expect(second).not.toBe(first);
    expect((await app.agent().get(`/api/auth/password-reset/${first}`)).body.error.code).toBe(
      'reset_not_found',
    );
    expect(
      (await app.agent().post(`/api/auth/password-reset/${second}`).send({ password: newPassword }))
        .status,
    ).toBe(200);
  });

  it('refuses a short password and unknown tokens', async () => {
    const user = await signUp(app, 'short');
    await requestReset(user.email);
    const token = await resetToken(user.email);
    const short = await app
      .agent()
      .post(`/api/auth/password-reset/${token}`)
      .send({ password: 'short' });
    expect(short.status).toBe(400);
    expect(short.body.error.fields.password).toBeTruthy();
    for (const t of ['x', 'B'.repeat(43)]) {
      const res = await app
        .agent()
        .post(`/api/auth/password-reset/${t}`)
        .send({ password: newPassword });
      expect(res.status).toBe(404);
      expect(res.body.error.code).toBe('reset_not_found');
    }
  });
});

describe('rate limit on reset requests', () => {
  const limited = useTestApp({ passwordResetRateLimit: 2 });

  it('answers 429 after too many requests from one client, known address or not', async () => {
    const statuses: number[] = [];
    for (let i = 0; i < 3; i++) {
      statuses.push(
        (
          await limited
            .agent()
            .post('/api/auth/password-reset')
            .send({ email: uniqueEmail('rl') })
        ).status,
      );
    }
    expect(statuses).toEqual([202, 202, 429]);
    // Its own counter: signing in is not held back by it.
    const user = await signUp(limited, 'rl');
    expect(
      (await limited.agent().post('/api/auth/sign-in').send({ email: user.email, password }))
        .status,
    ).toBe(200);
  });
});
