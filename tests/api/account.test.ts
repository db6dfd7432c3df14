/**
 * The account page's API (issue 20): a signed-in person changes their name, their e-mail
 * (with the current password; confirmed from the new address through the mail outbox) and
 * their password (with the current one; every other session ends).
 */
import { describe, expect, it } from 'vitest';
import { useTestApp } from '../helpers/app';
import { password, signUp, uniqueEmail } from '../helpers/factories';
import { tokenFrom } from '../helpers/mail';

const app = useTestApp({ accountRateLimit: 3 }, { mail: true });

async function confirmToken(email: string) {
  await app.mail.deliver();
  const mails = (await app.mail.to(email)).filter(
    (m) => m.subject === 'Confirm your new Headroom e-mail address',
  );
  expect(mails.length).toBeGreaterThan(0);
  return tokenFrom(mails.at(-1)!, '/confirm-email/');
}

describe('my name', () => {
  it('changes, and shows at once in /api/me', async () => {
    const user = await signUp(app, 'name');
    const res = await user.agent.patch('/api/me').send({ displayName: '  Teddy Brandt ' });
    expect(res.status).toBe(200);
    expect(res.body.user).toEqual({ id: user.id, email: user.email, displayName: 'Teddy Brandt' });
    expect((await user.agent.get('/api/me')).body.user.displayName).toBe('Teddy Brandt');
    const empty = await user.agent.patch('/api/me').send({ displayName: ' ' });
    expect(empty.status).toBe(400);
    expect(empty.body.error.fields.displayName).toBe('Enter your name');
    expect((await app.agent().patch('/api/me').send({ displayName: 'X' })).status).toBe(401);
  });
});

describe('my e-mail address', () => {
  it('changes only once the new address confirms, with the current password', async () => {
    const user = await signUp(app, 'mover');
    const next = uniqueEmail('moved');
    const wrong = await user.agent
      .post('/api/me/email')
      .send({ email: next, currentPassword: 'not-my-password' });
    expect(wrong.status).toBe(400);
    expect(wrong.body.error.fields).toEqual({
      currentPassword: 'That is not your current password',
    });
    await app.mail.deliver();
    expect(await app.mail.to(next)).toEqual([]);

    const asked = await user.agent
      .post('/api/me/email')
      .send({ email: next.toUpperCase(), currentPassword: password });
    expect(asked.status).toBe(202);
    expect(asked.body.message).toMatch(new RegExp(`follow the link we sent to ${next}`, 'i'));
    // Nothing changes until the link is followed.
    expect((await user.agent.get('/api/me')).body.user.email).toBe(user.email);

    const token = await confirmToken(next);
    const preview = await app.agent().get(`/api/email-changes/${token}`);
    expect(preview.body.change).toMatchObject({ email: next });
    const done = await app.agent().post(`/api/email-changes/${token}`).send({});
    expect(done.status).toBe(200);
    expect(done.body.user).toMatchObject({ id: user.id, email: next });
    expect((await user.agent.get('/api/me')).body.user.email).toBe(next);
    // The old address is told, with the way back.
    await app.mail.deliver();
    const [told] = (await app.mail.to(user.email)).filter((m) =>
      /address was changed/.test(m.subject ?? ''),
    );
    expect(told.textBody).toContain(next);
    expect(told.textBody).toContain('/forgot-password');

    const again = await app.agent().post(`/api/email-changes/${token}`).send({});
    expect(again.status).toBe(404);
    expect(again.body.error.code).toBe('email_change_used');
    const signIn = (email: string) =>
      app.agent().post('/api/auth/sign-in').send({ email, password });
    expect((await signIn(next)).status).toBe(200);
    expect((await signIn(user.email)).status).toBe(401);
  });

  it('answers the same for an address that already has an account, and tells only that address', async () => {
    const user = await signUp(app, 'curious');
    const other = await signUp(app, 'taken');
    const free = uniqueEmail('free');
    const a = await user.agent
      .post('/api/me/email')
      .send({ email: other.email, currentPassword: password });
    const b = await user.agent
      .post('/api/me/email')
      .send({ email: free, currentPassword: password });
    expect(a.status).toBe(202);
    expect(b.status).toBe(202);
    expect(a.body.message.replace(other.email, '*')).toBe(b.body.message.replace(free, '*'));
    await app.mail.deliver();
    const [note] = await app.mail.to(other.email);
    expect(note.subject).toBe('Someone tried to move a Headroom account to this address');
    expect(note.textBody).not.toContain('/confirm-email/');
    expect((await user.agent.get('/api/me')).body.user.email).toBe(user.email);
  });

  it('refuses the same address, a bad address and a dead link', async () => {
    const user = await signUp(app, 'same');
    const same = await user.agent
      .post('/api/me/email')
      .send({ email: user.email, currentPassword: password });
    expect(same.status).toBe(400);
    expect(same.body.error.fields.email).toBe('That is already your address');
    const bad = await user.agent.post('/api/me/email').send({ email: 'nope', currentPassword: '' });
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.body.error.fields).sort()).toEqual(['currentPassword', 'email']);
    expect((await app.agent().get('/api/email-changes/not-a-token')).status).toBe(404);
    expect(
      (await app.agent().post('/api/me/email').send({ email: 'a@b.test', currentPassword: 'x' }))
        .status,
    ).toBe(401);
  });
});

describe('my password', () => {
  it('changes with the current one, ends every other session and keeps this one', async () => {
    const user = await signUp(app, 'pw');
    const phone = app.agent();
    expect(
      (await phone.post('/api/auth/sign-in').send({ email: user.email, password })).status,
    ).toBe(200);
    const next = 'a-new-garage-passphrase';
    const wrong = await user.agent
      .put('/api/me/password')
      .send({ currentPassword: 'wrong-one', newPassword: next });
    expect(wrong.status).toBe(400);
    expect(wrong.body.error.fields.currentPassword).toBeTruthy();
    const short = await user.agent
      .put('/api/me/password')
      .send({ currentPassword: password, newPassword: 'short' });
    expect(short.status).toBe(400);
    expect(short.body.error.fields.newPassword).toBe('Use at least 10 characters');

    const ok = await user.agent
      .put('/api/me/password')
      .send({ currentPassword: password, newPassword: next });
    expect(ok.status).toBe(200);
    expect((await user.agent.get('/api/me')).status).toBe(200);
    expect((await phone.get('/api/me')).status).toBe(401);
    const signIn = (pw: string) =>
      app.agent().post('/api/auth/sign-in').send({ email: user.email, password: pw });
    expect((await signIn(next)).status).toBe(200);
    expect((await signIn(password)).status).toBe(401);
    await app.mail.deliver();
    expect(
      (await app.mail.to(user.email)).some(
        (m) => m.subject === 'Your Headroom password was changed',
      ),
    ).toBe(true);
  });

  it('stops guessing after a few wrong current passwords', async () => {
    const user = await signUp(app, 'guess');
    for (let i = 0; i < 3; i++) {
      const res = await user.agent
        .put('/api/me/password')
        .send({ currentPassword: `guess-${i}`, newPassword: 'whatever-long-enough' });
      expect(res.status).toBe(400);
    }
    const blocked = await user.agent
      .put('/api/me/password')
      .send({ currentPassword: password, newPassword: 'whatever-long-enough' });
    expect(blocked.status).toBe(429);
  });
});
