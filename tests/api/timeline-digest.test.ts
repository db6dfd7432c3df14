/**
 * The weekly digest: one mail a week to each member who switched it on, listing
 * what threatens the target date, through the outbox — never two for one week,
 * even with two server processes passing at the same moment.
 */
import { describe, expect, it } from 'vitest';
import { createDatabase } from '@server/lib/database';
import { createLogger } from '@server/lib/logger';
import { claimWeek } from '@server/features/timeline/digest.repository';
import { createDigestWorker } from '@server/features/timeline/digest.worker';
import { useTestApp } from '../helpers/app';
import { recipients } from '../helpers/mail';
import { buildWithCast } from '../helpers/factories';

const app = useTestApp({}, { mail: true });

// America/Denver is on daylight time (UTC−6) from 14 March 2027 (IANA time zone database).
const mondayEarly = new Date('2027-03-15T12:30:00Z'); // 06:30 MDT, Monday 15 March
const mondayMorning = new Date('2027-03-15T13:30:00Z'); // 07:30 MDT
const wednesday = new Date('2027-03-17T18:00:00Z');
const nextMonday = new Date('2027-03-22T14:00:00Z');

const worker = (now: Date, knex = app.db.knex) =>
  createDigestWorker({ knex, logger: createLogger('silent'), now: () => now });

async function scenario() {
  const cast = await buildWithCast(app);
  const { owner, shop, build } = cast;
  const base = `/api/builds/${build.id}`;
  await owner.agent
    .patch(base)
    .send({ targetDate: '2027-05-30', targetEvent: 'Mesa pull', timeZone: 'America/Denver' })
    .expect(200);
  await owner.agent
    .post(`${base}/parts`)
    .send({
      category: 'cooling',
      name: 'Intercooler, backordered',
      status: 'ordered',
      expectedOn: '2027-05-28',
      unitPriceCents: 154_321,
    })
    .expect(201);
  await owner.agent
    .post(`${base}/parts`)
    .send({
      category: 'fuel-injection',
      name: 'Injectors at the bench',
      status: 'at-shop',
      shopUserId: shop.id,
      sentOutOn: '2027-03-01',
      turnaroundDays: 100,
      labourCents: 88_800,
    })
    .expect(201);
  for (const m of [cast.owner, cast.crew, cast.shop]) {
    await m.agent.put(`${base}/notice-preferences`).send({ 'timeline-digest': true }).expect(200);
  }
  return { ...cast, base };
}

const digestRows = (buildId: string) =>
  app.db.knex('timeline_digests').where({ build_id: buildId }).orderBy('week_of');

async function digestsTo(email: string) {
  return (await app.mail.to(email)).filter((m) => m.subject?.includes(' this week: '));
}

describe('the weekly timeline digest', () => {
  it('goes once to each member who switched it on, from 07:00 on Monday in the build’s zone', async () => {
    const s = await scenario();
    expect((await worker(mondayEarly).runOnce()).queued).toBe(0);
    expect(await digestRows(s.build.id)).toEqual([]);

    expect((await worker(mondayMorning).runOnce()).queued).toBe(3);
    await app.mail.deliver();
    for (const m of [s.owner, s.crew, s.shop]) expect(await digestsTo(m.email)).toHaveLength(1);
    // The viewer never switched it on: it is off unless chosen.
    expect(await digestsTo(s.viewer.email)).toEqual([]);

    const [mail] = await digestsTo(s.owner.email);
    expect(recipients(mail)).toEqual([s.owner.email]);
    expect(mail.subject).toBe('Test hauler this week: 2 things threaten the date');
    expect(mail.textBody).toContain('76 days to Mesa pull, on Sun, May 30, 2027.');
    expect(mail.textBody).toContain(
      '• Intercooler, backordered: Expected May 28, 5 days after the parts cut-off (May 23).',
    );
    expect(mail.textBody).toContain(
      '• Injectors at the bench: Due back from Test shop Jun 9, 17 days after the parts cut-off (May 23).',
    );
    expect(mail.textBody).toContain(`${app.origin}/builds/${s.build.id}/timeline`);
    expect(mail.textBody).toContain('Days are counted in America/Denver');

    // The shop's digest names only the part sent to it.
    const [shopMail] = await digestsTo(s.shop.email);
    expect(shopMail.subject).toBe('Test hauler this week: 1 of your parts threatens the date');
    expect(shopMail.textBody).toContain('Injectors at the bench');
    expect(shopMail.textBody).not.toContain('Intercooler');
    expect(shopMail.textBody).toContain('As a shop, you see only the parts sent to you.');

    // No money in any digest.
    for (const m of [s.owner, s.crew, s.shop]) {
      for (const d of await digestsTo(m.email)) {
        const all = `${d.subject}\n${d.textBody}\n${d.html}`.replaceAll(app.origin, '');
        expect(all).not.toMatch(/\$|USD|1543|888\.00|88800|cents/i);
      }
    }
  });

  it('is never sent twice for one week, even by two processes at once', async () => {
    const s = await scenario();
    const second = createDatabase(
      (app.db.pool as unknown as { options: { connectionString: string } }).options
        .connectionString,
    );
    try {
      await Promise.all([
        worker(mondayMorning).runOnce(),
        worker(mondayMorning, second.knex).runOnce(),
      ]);
      expect(await digestRows(s.build.id)).toHaveLength(3);
      // Later in the same week, from either process: nothing more.
      await Promise.all([worker(wednesday).runOnce(), worker(wednesday, second.knex).runOnce()]);
      expect(await digestRows(s.build.id)).toHaveLength(3);
    } finally {
      await second.close();
    }
    const outbox = await app.db
      .knex('mail_outbox')
      .where({ kind: 'digest:timeline' })
      .whereIn('to_address', [s.owner.email, s.crew.email, s.shop.email]);
    expect(outbox).toHaveLength(3);
    await app.mail.deliver();
    for (const m of [s.owner, s.crew, s.shop]) expect(await digestsTo(m.email)).toHaveLength(1);

    // The next week brings one more each.
    await worker(nextMonday).runOnce();
    expect((await digestRows(s.build.id)).map((r) => r.week_of)).toEqual([
      ...Array(3).fill('2027-03-15'),
      ...Array(3).fill('2027-03-22'),
    ]);
  });

  it('lets one claim of a member’s week win while another transaction waits on it', async () => {
    const s = await scenario();
    const knex = app.db.knex;
    const first = await knex.transaction();
    const second = await knex.transaction();
    try {
      expect(await claimWeek(first, s.build.id, s.crew.id, '2027-03-15')).toBe(true);
      const waiting = claimWeek(second, s.build.id, s.crew.id, '2027-03-15');
      await first.commit();
      expect(await waiting).toBe(false);
    } finally {
      await second.rollback().catch(() => undefined);
    }
  });

  it('stops when switched off, and is not sent for a build without a target date or past it', async () => {
    const s = await scenario();
    await s.crew.agent
      .put(`${s.base}/notice-preferences`)
      .send({ 'timeline-digest': false })
      .expect(200);
    await worker(mondayMorning).runOnce();
    expect((await digestRows(s.build.id)).map((r) => r.user_id).sort()).toEqual(
      [s.owner.id, s.shop.id].sort(),
    );

    const other = await buildWithCast(app);
    const url = `/api/builds/${other.build.id}`;
    await other.owner.agent.patch(url).send({ targetDate: null }).expect(200);
    await other.owner.agent
      .put(`${url}/notice-preferences`)
      .send({ 'timeline-digest': true })
      .expect(200);
    await worker(nextMonday).runOnce();
    await other.owner.agent.patch(url).send({ targetDate: '2027-03-01' }).expect(200);
    await worker(new Date('2027-03-29T14:00:00Z')).runOnce();
    expect(await digestRows(other.build.id)).toEqual([]);
    // The first build's members kept getting theirs meanwhile.
    expect(await digestRows(s.build.id)).toHaveLength(6);
  });
});
