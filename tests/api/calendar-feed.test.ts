/**
 * The calendar feed: a member's secret link to the build's dates as iCalendar
 * (RFC 5545). The text is read back with ical.js (2.x), a parser independent of
 * ical-generator that writes it, and checked field by field; line folding, CRLF
 * and DATE values are checked on the raw text, because ical.js also reads badly
 * folded lines.
 */
import ICAL from 'ical.js';
import { describe, expect, it } from 'vitest';
import { addDays, todayIn } from '@shared/dates';
import { hashToken } from '@server/lib/tokens';
import { useTestApp, type Agent } from '../helpers/app';
import { buildWithCast, type TestUser } from '../helpers/factories';

const app = useTestApp();

async function scenario() {
  const cast = await buildWithCast(app);
  const { owner, shop, build } = cast;
  const base = `/api/builds/${build.id}`;
  const today = todayIn('America/Denver');
  const day = (n: number) => addDays(today, n);
  await owner.agent
    .patch(`/api/builds/${build.id}`)
    .send({ targetDate: day(60), targetEvent: 'Spring pull', timeZone: 'America/Denver' })
    .expect(200);
  const post = async (url: string, body: object) =>
    (await owner.agent.post(`${base}${url}`).send(body).expect(201)).body;
  const turbo = (
    await post('/parts', {
      category: 'turbocharger',
      name: 'Drop-in turbo',
      status: 'ordered',
      expectedOn: day(56),
      unitPriceCents: 289_000,
    })
  ).part;
  const injectors = (
    await post('/parts', {
      category: 'fuel-injection',
      name: 'Injectors for rebuild',
      status: 'at-shop',
      shopUserId: shop.id,
      sentOutOn: day(-3),
      turnaroundDays: 10,
      labourCents: 96_000,
    })
  ).part;
  // A long title with characters of two and three octets, to be folded between octets.
  const longTitle =
    'Engine back together — heads torqued, injectors seated, lines primed, “ready for the first start” (Ünïcode check)';
  const milestone = (await post('/milestones', { title: longTitle, dueOn: day(20) })).milestone;
  return { ...cast, base, day, turbo, injectors, milestone, longTitle };
}

async function makeFeed(user: TestUser, base: string) {
  const res = await user.agent.post(`${base}/calendar-feed`);
  expect(res.status).toBe(201);
  return res.body.feed as { url: string; webcalUrl: string; createdAt: string };
}

/** The path of a feed URL, fetched without any session (as a phone's calendar does). */
async function fetchFeed(url: string) {
  return app.bare().get(new URL(url).pathname);
}

function events(text: string) {
  const calendar = new ICAL.Component(ICAL.parse(text) as unknown[]);
  return {
    calendar,
    events: calendar.getAllSubcomponents('vevent').map((v) => new ICAL.Event(v)),
  };
}

describe('a member’s calendar feed', () => {
  it('carries the target date, milestones, arrivals and send-outs due, field by field (read by ical.js)', async () => {
    const s = await scenario();
    const feed = await makeFeed(s.owner, s.base);
    expect(feed.url).toMatch(
      new RegExp(`^${app.origin}/api/calendar-feeds/[A-Za-z0-9_-]{43}/calendar\\.ics$`),
    );
    expect(feed.webcalUrl).toBe(feed.url.replace(/^http:/, 'webcal:'));
    const res = await fetchFeed(feed.url);
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toBe('text/calendar; charset=utf-8');
    const { calendar, events: list } = events(res.text);
    expect(calendar.getFirstPropertyValue('version')).toBe('2.0');
    expect(calendar.getFirstPropertyValue('prodid')).toBe('-//Headroom//Timeline//EN');
    expect(calendar.getFirstPropertyValue('x-wr-calname')).toBe('Test hauler · Headroom');
    const host = new URL(app.origin).hostname;
    const byUid = new Map(list.map((e) => [e.uid, e]));
    expect([...byUid.keys()].sort()).toEqual(
      [
        `target-${s.build.id}@${host}`,
        `milestone-${s.milestone.id}@${host}`,
        `part-expected-${s.turbo.id}@${host}`,
        `send-out-due-${s.injectors.id}@${host}`,
      ].sort(),
    );
    const check = (uid: string, summary: string, date: string) => {
      const e = byUid.get(`${uid}@${host}`)!;
      expect(e.summary).toBe(summary);
      expect(e.startDate.isDate).toBe(true);
      expect(e.startDate.toString()).toBe(date);
      // All day: DTEND is the next day, exclusive (RFC 5545 §3.6.1).
      expect(e.endDate.isDate).toBe(true);
      expect(e.endDate.toString()).toBe(addDays(date, 1));
      return e;
    };
    const target = check(`target-${s.build.id}`, 'Target date: Spring pull', s.day(60));
    expect(target.component.getFirstPropertyValue('url')).toBe(
      `${app.origin}/builds/${s.build.id}/timeline`,
    );
    check(`milestone-${s.milestone.id}`, `Milestone: ${s.longTitle}`, s.day(20));
    const turbo = check(`part-expected-${s.turbo.id}`, 'Expected: Drop-in turbo', s.day(56));
    // 56 is 3 days after the cut-off (60 − 7): the event says why it matters.
    expect(turbo.description).toContain('Threatens the target date: Expected');
    expect(turbo.description).toContain('3 days after the parts cut-off');
    check(`send-out-due-${s.injectors.id}`, 'Due back: Injectors for rebuild', s.day(7));
    // Every event is stamped (DTSTAMP is required, RFC 5545 §3.6.1).
    for (const e of list) expect(e.component.getFirstPropertyValue('dtstamp')).toBeTruthy();
    // No money, in any form.
    expect(res.text).not.toMatch(/\$|USD|2890|960\.00|96000|289000|cents/i);
  });

  it('is folded at 75 octets with CRLF and writes all-day dates as DATE values (checked on the raw text, RFC 5545 §3.1 and §3.3.4)', async () => {
    const s = await scenario();
    const text = (await fetchFeed((await makeFeed(s.owner, s.base)).url)).text;
    // Every line ends in CRLF, the last one too; no bare LF or CR anywhere.
    expect(text.endsWith('\r\n')).toBe(true);
    expect(text.replaceAll('\r\n', '')).not.toMatch(/[\r\n]/);
    const lines = text.slice(0, -2).split('\r\n');
    // RFC 5545 §3.1: lines SHOULD NOT be longer than 75 octets, excluding the line break.
    for (const line of lines) expect(Buffer.byteLength(line, 'utf8'), line).toBeLessThanOrEqual(75);
    // The long milestone title had to be folded: a continuation line starts with one space.
    expect(lines.some((l) => l.startsWith(' '))).toBe(true);
    // Folding never splits a multi-octet character: a split one would decode as U+FFFD.
    expect(text).not.toContain('\uFFFD');
    // RFC 5545 §3.3.4: all-day dates are DATE values, YYYYMMDD with no time part.
    const starts = lines.filter((l) => l.startsWith('DTSTART'));
    expect(starts).toHaveLength(4);
    for (const l of [...starts, ...lines.filter((x) => x.startsWith('DTEND'))]) {
      expect(l).toMatch(/^DT(START|END);VALUE=DATE:\d{8}$/);
    }
    expect(starts).toContain(`DTSTART;VALUE=DATE:${s.day(60).replaceAll('-', '')}`);
    // Unfolded (§3.1: remove CRLF and one whitespace) and unescaped (TEXT, §3.3.11: a
    // backslash before a comma), the title is whole again.
    const unfolded = text.replace(/\r\n[ \t]/g, '').replace(/\\([,;\\])/g, '$1');
    expect(unfolded).toContain(`SUMMARY:Milestone: ${s.longTitle}\r\n`);
  });

  it('answers a calendar polling with the ETag it was given 304, and 200 again once the feed changes', async () => {
    const s = await scenario();
    const feed = await makeFeed(s.owner, s.base);
    const first = await fetchFeed(feed.url);
    const etag = first.headers.etag;
    expect(etag).toMatch(/^W\/"[0-9a-f]+-[A-Za-z0-9+/]{27}"$/);
    const again = await app.bare().get(new URL(feed.url).pathname).set('If-None-Match', etag);
    expect(again.status).toBe(304);
    await s.owner.agent.patch(s.base).send({ targetDate: '2027-09-01' }).expect(200);
    const changed = await app.bare().get(new URL(feed.url).pathname).set('If-None-Match', etag);
    expect(changed.status).toBe(200);
    expect(changed.headers.etag).not.toBe(etag);
  });

  it('keeps each event’s UID when a date changes, so a calendar updates it instead of adding one', async () => {
    const s = await scenario();
    const feed = await makeFeed(s.owner, s.base);
    const before = events((await fetchFeed(feed.url)).text).events;
    await s.owner.agent
      .patch(`${s.base}/milestones/${s.milestone.id}`)
      .send({ dueOn: s.day(25) })
      .expect(200);
    const after = events((await fetchFeed(feed.url)).text).events;
    expect(after.map((e) => e.uid).sort()).toEqual(before.map((e) => e.uid).sort());
    const moved = after.find((e) => e.uid.startsWith(`milestone-${s.milestone.id}`))!;
    expect(moved.startDate.toString()).toBe(s.day(25));
  });

  it('shows a shop the target and only its own parts', async () => {
    const s = await scenario();
    const text = (await fetchFeed((await makeFeed(s.shop, s.base)).url)).text;
    const summaries = events(text).events.map((e) => e.summary);
    expect(summaries.sort()).toEqual(
      ['Due back: Injectors for rebuild', 'Target date: Spring pull'].sort(),
    );
    expect(text).not.toContain('Drop-in turbo');
    expect(text).not.toContain('Engine back together');
  });

  it('stores only a hash of a 256-bit token, shows the URL once, and a new link ends the old one', async () => {
    const s = await scenario();
    const first = await makeFeed(s.crew, s.base);
    const token = first.url.split('/').at(-2)!;
    expect(Buffer.from(token, 'base64url')).toHaveLength(32);
    const row = await app.db
      .knex('calendar_feeds')
      .where({ build_id: s.build.id, user_id: s.crew.id })
      .first();
    expect(row.token_hash).toBe(hashToken(token));
    expect(JSON.stringify(row)).not.toContain(token);
    const got = await s.crew.agent.get(`${s.base}/calendar-feed`);
    expect(got.body.feed).toEqual({ createdAt: expect.any(String) });

    const second = await makeFeed(s.crew, s.base);
    expect(second.url).not.toBe(first.url);
    expect((await fetchFeed(first.url)).status).toBe(404);
    expect((await fetchFeed(second.url)).status).toBe(200);

    expect((await s.crew.agent.delete(`${s.base}/calendar-feed`)).status).toBe(204);
    expect((await fetchFeed(second.url)).status).toBe(404);
    expect((await s.crew.agent.get(`${s.base}/calendar-feed`)).body.feed).toBeNull();
  });

  it('answers 404 to a wrong token, a malformed one and a removed member’s link', async () => {
    const s = await scenario();
    const viewerFeed = await makeFeed(s.viewer, s.base);
    expect((await fetchFeed(viewerFeed.url)).status).toBe(200);
    const wrong = `${app.origin}/api/calendar-feeds/${'A'.repeat(43)}/calendar.ics`;
    expect((await fetchFeed(wrong)).status).toBe(404);
    expect((await app.bare().get('/api/calendar-feeds/not-a-token/calendar.ics')).status).toBe(404);
    await s.owner.agent.delete(`${s.base}/members/${s.viewer.id}`).expect(204);
    const gone = await fetchFeed(viewerFeed.url);
    expect(gone.status).toBe(404);
    expect(gone.text).not.toContain('BEGIN:VCALENDAR');
  });

  it('is each member’s own: every role may make one; a stranger gets 404 and signed out 401', async () => {
    const s = await scenario();
    for (const m of [s.owner, s.crew, s.shop, s.viewer]) await makeFeed(m, s.base);
    const rows = await app.db.knex('calendar_feeds').where({ build_id: s.build.id });
    expect(rows).toHaveLength(4);
    const url = `${s.base}/calendar-feed`;
    for (const call of [
      (a: Agent) => a.get(url),
      (a: Agent) => a.post(url),
      (a: Agent) => a.delete(url),
    ]) {
      expect((await call(s.stranger.agent)).status).toBe(404);
      expect((await call(app.agent())).status).toBe(401);
    }
  });
});
