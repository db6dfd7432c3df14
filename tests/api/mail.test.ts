import { describe, expect, it } from 'vitest';
import { claimDue, enqueueMail } from '@server/features/mail/mail.repository';
import { createMailWorker, defaultMaxAttempts } from '@server/features/mail/mail.worker';
import { createLogger } from '@server/lib/logger';
import { createMailer } from '@server/lib/mailer';
import { useTestApp } from '../helpers/app';
import { buildWithCast, signUp, uniqueEmail } from '../helpers/factories';
import { readMailbox, recipients } from '../helpers/mail';

const app = useTestApp({}, { mail: true });

const outboxFor = (email: string) => app.db.knex('mail_outbox').where({ to_address: email });

describe('when the SMTP server is down', () => {
  it('still answers the request, keeps the mail queued with backoff, and sends it once the server is back', async () => {
    const { owner, build } = await buildWithCast(app);
    const email = uniqueEmail('patient');
    await app.mail.stopCatcher();
    try {
      const res = await owner.agent
        .post(`/api/builds/${build.id}/invitations`)
        .send({ email, role: 'crew' });
      expect(res.status).toBe(201);
      const reset = await app.agent().post('/api/auth/password-reset').send({ email: owner.email });
      expect(reset.status).toBe(202);

      const first = await app.mail.worker.runOnce();
      expect(first).toMatchObject({ sent: 0, failed: 0 });
      expect(first.retrying).toBeGreaterThanOrEqual(2);
      const [row] = await outboxFor(email);
      expect(row).toMatchObject({ status: 'queued', attempts: 1 });
      expect(row.last_error).toMatch(/ECONNREFUSED|connect/i);
      // The first retry waits about 30 seconds, not less.
      const wait = new Date(row.next_attempt_at).getTime() - Date.now();
      expect(wait).toBeGreaterThan(25_000);
      expect(wait).toBeLessThan(35_000);
      expect((await app.mail.worker.runOnce()).claimed).toBe(0);
    } finally {
      await app.mail.startCatcher();
    }
    expect(await app.mail.to(email)).toEqual([]);
    app.mail.advanceClock(31_000);
    await app.mail.deliver();
    const mails = await app.mail.to(email);
    expect(mails).toHaveLength(1);
    expect(mails[0].subject).toMatch(/invited to a build/);
    expect((await app.mail.to(owner.email)).map((m) => m.subject)).toContain(
      'Set a new Headroom password',
    );
    expect((await outboxFor(email))[0]).toMatchObject({
      status: 'sent',
      attempts: 2,
      last_error: null,
    });
  });

  it('gives a mail up as failed after the last attempt, keeping the reason and dropping the link', async () => {
    const email = uniqueEmail('doomed');
    await enqueueMail(app.db.knex, {
      kind: 'test',
      to: email,
      subject: 'Doomed',
      heading: 'Doomed',
      body: 'Never arrives.',
      action: { label: 'Open', path: '/secret-link' },
    });
    await app.mail.stopCatcher();
    try {
      for (let i = 0; i < defaultMaxAttempts; i++) {
        await app.mail.worker.runOnce();
        app.mail.advanceClock(3_600_000);
      }
    } finally {
      await app.mail.startCatcher();
    }
    const [row] = await outboxFor(email);
    expect(row).toMatchObject({
      status: 'failed',
      attempts: defaultMaxAttempts,
      action_path: null,
      body_text: '',
    });
    expect(row.last_error).toBeTruthy();
    await app.mail.deliver();
    expect(await app.mail.to(email)).toEqual([]);
  });
});

describe('the outbox across restarts and processes', () => {
  it('loses nothing queued: a worker started later (a new process) sends what an earlier one never did', async () => {
    const user = await signUp(app, 'restart');
    await app.agent().post('/api/auth/password-reset').send({ email: user.email });
    // A process that claimed the mail and died before sending: the lease keeps it
    // from others for five minutes, then anyone may take it.
    const claimed = await claimDue(app.db.knex, new Date(), new Date(Date.now() + 5 * 60_000), 100);
    expect(claimed.map((r) => r.to_address)).toContain(user.email);

    let offset = 0;
    const mailer = createMailer({
      from: 'Headroom <headroom@localhost>',
      smtp: null,
      catcherPort: app.mail.port,
    });
    const fresh = createMailWorker({
      knex: app.db.knex,
      mailer,
      logger: createLogger('silent'),
      appUrl: app.origin,
      now: () => new Date(Date.now() + offset),
    });
    try {
      await fresh.drain();
      expect(await app.mail.to(user.email)).toEqual([]);
      offset = 5 * 60_000 + 1000;
      await fresh.drain();
    } finally {
      mailer.close();
    }
    expect(await app.mail.to(user.email)).toHaveLength(1);
  });

  it('never sends one mail twice when two workers run at the same moment', async () => {
    // Both workers on the real clock: earlier tests moved the app worker's clock hours ahead,
    // and a worker that far ahead rightly sees the other's 5-minute leases as run out.
    app.mail.resetClock();
    const emails = Array.from({ length: 12 }, () => uniqueEmail('once'));
    await enqueueMail(
      app.db.knex,
      emails.map((to) => ({
        kind: 'test',
        to,
        subject: 'Exactly once',
        heading: 'Exactly once',
        body: 'One copy only.',
      })),
    );
    const mailer = createMailer({
      from: 'Headroom <headroom@localhost>',
      smtp: null,
      catcherPort: app.mail.port,
    });
    const other = createMailWorker({
      knex: app.db.knex,
      mailer,
      logger: createLogger('silent'),
      appUrl: app.origin,
      batchSize: 3,
    });
    try {
      const [a, b] = await Promise.all([app.mail.worker.drain(), other.drain()]);
      expect(a.sent + b.sent).toBeGreaterThanOrEqual(12);
    } finally {
      mailer.close();
    }
    const caught = (await readMailbox(app.mail.dir)).filter((m) => m.subject === 'Exactly once');
    expect(caught.flatMap(recipients).sort()).toEqual([...emails].sort());
  });
});

describe('keeping the outbox small', () => {
  it('forgets sent and failed mail after 30 days, never queued mail', async () => {
    const [oldSent, oldFailed, oldQueued, recent] = Array.from({ length: 4 }, () =>
      uniqueEmail('purge'),
    );
    await enqueueMail(
      app.db.knex,
      [oldSent, oldFailed, oldQueued, recent].map((to) => ({
        kind: 'test',
        to,
        subject: 'Purge',
        heading: 'Purge',
        body: '.',
      })),
    );
    const longAgo = new Date(Date.now() - 31 * 24 * 3600_000);
    await app.db
      .knex('mail_outbox')
      .where({ to_address: oldSent })
      .update({ status: 'sent', updated_at: longAgo });
    await app.db
      .knex('mail_outbox')
      .where({ to_address: oldFailed })
      .update({ status: 'failed', updated_at: longAgo });
    await app.db
      .knex('mail_outbox')
      .where({ to_address: oldQueued })
      .update({ updated_at: longAgo, next_attempt_at: new Date(Date.now() + 3600_000 * 24 * 365) });
    await app.db.knex('mail_outbox').where({ to_address: recent }).update({ status: 'sent' });
    await app.mail.worker.purge();
    const left = await app.db
      .knex('mail_outbox')
      .whereIn('to_address', [oldSent, oldFailed, oldQueued, recent])
      .pluck('to_address');
    expect(left.sort()).toEqual([oldQueued, recent].sort());
  });
});

describe('/dev/mail', () => {
  it('lists caught messages and shows each as a page, as JSON, as its HTML part and as the raw .eml', async () => {
    const email = uniqueEmail('devmail');
    await enqueueMail(app.db.knex, {
      kind: 'test',
      to: email,
      subject: 'Seen at /dev/mail <b>',
      heading: 'Hello',
      body: 'Plain words.',
      action: { label: 'Open it', path: '/builds' },
    });
    await app.mail.deliver();

    const list = await app.agent().get('/dev/mail?format=json');
    expect(list.status).toBe(200);
    const entry = list.body.messages.find((m: { to: string }) => m.to.includes(email));
    expect(entry).toMatchObject({
      subject: 'Seen at /dev/mail <b>',
      links: [`${app.origin}/builds`],
    });

    const html = await app.agent().get('/dev/mail');
    expect(html.status).toBe(200);
    expect(html.type).toBe('text/html');
    expect(html.text).toContain(`/dev/mail/${entry.file}`);
    expect(html.text).toContain('Seen at /dev/mail &lt;b&gt;');

    const one = await app.agent().get(`/dev/mail/${entry.file}`).set('Accept', 'application/json');
    expect(one.body.message).toMatchObject({ file: entry.file, subject: 'Seen at /dev/mail <b>' });
    expect((await app.agent().get(`/dev/mail/${entry.file}`)).text).toContain('Plain words.');
    expect((await app.agent().get(`/dev/mail/${entry.file}/html`)).text).toContain('#1b2230');
    expect((await app.agent().get(`/dev/mail/${entry.file}/raw`)).text).toMatch(
      /^Content-Type|MIME-Version|From:/m,
    );
  });

  it('answers 404 for files that are not caught messages', async () => {
    for (const file of ['nope.eml', '..%2F..%2Fetc%2Fpasswd', '20261202T000000000Z-00000000.eml']) {
      expect((await app.agent().get(`/dev/mail/${file}`)).status).toBe(404);
    }
  });
});

describe('/dev/mail where it must not exist', () => {
  const production = useTestApp({ env: 'production' });
  const realSmtp = useTestApp({
    mail: {
      from: 'Headroom <h@example.test>',
      smtp: { url: 'smtp://127.0.0.1:1' },
      catcherPort: 1,
      dir: '/tmp',
      pollMs: 1000,
    },
  });

  it('is 404 in production and when real SMTP is configured', async () => {
    for (const a of [production, realSmtp]) {
      expect((await a.agent().get('/dev/mail')).status).toBe(404);
      expect((await a.agent().get('/dev/mail?format=json')).status).toBe(404);
    }
  });
});
