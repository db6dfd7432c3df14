/**
 * "Overdue at the shop" (issue 20): a part at a shop past its sent-out date plus the
 * promised turnaround is told to the owner and that shop, once per part per overdue spell,
 * also when two server processes look at the same moment. This file has its own database
 * (mail: true), so the pass sees only its own parts.
 */
import { describe, expect, it } from 'vitest';
import { createOverdueWorker, notifyOverdueParts } from '@server/features/parts';
import { createDatabase } from '@server/lib/database';
import { createLogger } from '@server/lib/logger';
import { useTestApp } from '../helpers/app';
import { buildWithCast } from '../helpers/factories';
import { recipients } from '../helpers/mail';

const app = useTestApp({}, { mail: true });

async function sentOut(turnaroundDays = 10) {
  const cast = await buildWithCast(app);
  const base = `/api/builds/${cast.build.id}`;
  const res = await cast.owner.agent.post(`${base}/parts`).send({
    category: 'fuel-injection',
    name: 'Injector set',
    partNumber: 'RB-8',
    status: 'at-shop',
    shopUserId: cast.shop.id,
    sentOutOn: '2026-01-05',
    turnaroundDays,
    labourCents: 90_000,
  });
  expect(res.status, JSON.stringify(res.body)).toBe(201);
  return { ...cast, base, part: res.body.part };
}

/** Noon UTC of a day: that day for a build in UTC. */
const at = (day: string) => new Date(`${day}T12:00:00Z`);

const overdueMail = () =>
  app.db.knex('mail_outbox').where({ kind: 'notice:part-overdue-at-shop' }).orderBy('to_address');

describe('the overdue-at-the-shop notice', () => {
  it('goes to the owner and the shop once the promised day has passed, and once only', async () => {
    const c = await sentOut(10); // due back 2026-01-15
    expect(await notifyOverdueParts(app.db.knex, at('2026-01-15'))).toBe(0);
    expect(await notifyOverdueParts(app.db.knex, at('2026-01-16'))).toBe(1);
    expect(await notifyOverdueParts(app.db.knex, at('2026-01-17'))).toBe(0);
    expect(await notifyOverdueParts(app.db.knex, at('2026-02-20'))).toBe(0);

    const rows = await overdueMail();
    expect(rows.map((r) => r.to_address).sort()).toEqual([c.owner.email, c.shop.email].sort());
    await app.mail.deliver();
    const [toOwner] = await app.mail.to(c.owner.email);
    expect(toOwner.subject).toMatch(/Injector set overdue at Test shop/);
    expect(toOwner.textBody).toMatch(
      /went out at Test shop on January 5, 2026 with a turnaround of 10 days, so it was due back on January 15, 2026: 1 day ago/,
    );
    // No money in a notice, ever (the shop's quote is on the part).
    expect(toOwner.textBody).not.toMatch(/\$|900/);
    const [toShop] = await app.mail.to(c.shop.email);
    expect(recipients(toShop)).toEqual([c.shop.email]);
    expect((await app.mail.to(c.crew.email)).length).toBe(0);
    expect((await app.mail.to(c.viewer.email)).length).toBe(0);
  });

  it('tells a new spell again: a later promise that also passes, or a new send-out', async () => {
    const c = await sentOut(10);
    const before = (await overdueMail()).length;
    await notifyOverdueParts(app.db.knex, at('2026-01-20'));
    // The shop promised ten more days: quiet until those pass too.
    await c.owner.agent.patch(`${c.base}/parts/${c.part.id}`).send({ turnaroundDays: 20 });
    expect(await notifyOverdueParts(app.db.knex, at('2026-01-25'))).toBe(0);
    expect(await notifyOverdueParts(app.db.knex, at('2026-01-26'))).toBe(1);
    // Back in the garage: nothing more.
    await c.crew.agent
      .patch(`${c.base}/parts/${c.part.id}`)
      .send({ status: 'in-hand', backOn: '2026-01-27' });
    expect(await notifyOverdueParts(app.db.knex, at('2026-03-01'))).toBe(0);
    expect((await overdueMail()).length - before).toBe(4);
  });

  it('goes out once when two server processes pass at the same moment', async () => {
    await sentOut(3); // due back 2026-01-08
    // A second process: its own pool on the same database.
    const conn = app.db.knex.client.config.connection as string | { connectionString: string };
    const other = createDatabase(typeof conn === 'string' ? conn : conn.connectionString);
    try {
      const counts = await Promise.all([
        notifyOverdueParts(app.db.knex, at('2026-01-09')),
        notifyOverdueParts(other.knex, at('2026-01-09')),
        notifyOverdueParts(app.db.knex, at('2026-01-09')),
      ]);
      expect(counts.reduce((a, b) => a + b, 0)).toBe(1);
    } finally {
      await other.close();
    }
  });

  it('runs as a periodic pass in the server process, on the server’s clock', async () => {
    const c = await sentOut(1);
    const worker = createOverdueWorker({
      knex: app.db.knex,
      logger: createLogger('silent'),
      now: () => new Date('2026-01-07T08:00:00Z'),
    });
    expect(await worker.runOnce()).toBe(1);
    const rows = await app.db.knex('part_overdue_notices').where({ part_id: c.part.id });
    expect(rows).toMatchObject([{ sent_out_on: '2026-01-05', due_on: '2026-01-06' }]);
    await worker.stop();
  });

  it("judges each part by its build's today, in the build's time zone", async () => {
    const c = await sentOut(10); // due back 2026-01-15
    // IANA tz database: Pacific/Kiritimati is UTC+14 (no daylight saving), so 2026-01-15T09:59Z
    // is 23:59 on the 15th there and 2026-01-15T10:00Z is midnight starting the 16th.
    await app.db
      .knex('builds')
      .where({ id: c.build.id })
      .update({ time_zone: 'Pacific/Kiritimati' });
    const told = () => app.db.knex('part_overdue_notices').where({ part_id: c.part.id });
    await notifyOverdueParts(app.db.knex, new Date('2026-01-15T09:59:00Z'));
    expect(await told()).toEqual([]);
    await notifyOverdueParts(app.db.knex, new Date('2026-01-15T10:00:00Z'));
    expect(await told()).toHaveLength(1);
  });
});
