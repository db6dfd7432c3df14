/**
 * A member's calendar feed as iCalendar text (RFC 5545), made with ical-generator:
 * every item the timeline marks for the calendar as an all-day event — DTSTART and
 * DTEND as DATE values, DTEND the day after (exclusive) — with a UID made from the
 * item's stable key, so a subscribed calendar updates an event rather than adding
 * it again. ical-generator folds lines at 75 octets with CRLF (RFC 5545 §3.1); the
 * last line gets its CRLF here, which the library leaves off.
 * Only what the timeline answer holds goes in: it carries no money.
 */
import ical, { ICalCalendarMethod } from 'ical-generator';
import { addDays } from '@shared/dates';
import type { Timeline, TimelineItem } from '@shared/schemas/timeline';
import { linkPath } from './links';

const summaries: Record<TimelineItem['kind'], (i: TimelineItem) => string> = {
  target: (i) => (i.title === 'Target date' ? 'Target date' : `Target date: ${i.title}`),
  milestone: (i) => `Milestone: ${i.title}${i.done ? ' (done)' : ''}`,
  'part-expected': (i) => `Expected: ${i.title}`,
  'send-out-due': (i) => `Due back: ${i.title}`,
  job: (i) => `Install job: ${i.title}`,
  'dyno-session': (i) => i.title,
};

/** A UTC midnight: ical-generator writes an all-day date from the UTC calendar date. */
const utcDay = (date: string) => new Date(`${date}T00:00:00Z`);

export function feedIcs(opts: {
  buildId: string;
  buildName: string;
  timeline: Timeline;
  appUrl: string;
}): string {
  const { buildId, buildName, timeline, appUrl } = opts;
  const host = new URL(appUrl).hostname;
  const calendar = ical({
    name: `${buildName} · Headroom`,
    description: `Dates of the build “${buildName}”: the target date, milestones, parts expected, send-outs due back and dyno days.`,
    prodId: { company: 'Headroom', product: 'Timeline', language: 'EN' },
    method: ICalCalendarMethod.PUBLISH,
    // Phones poll a subscribed calendar; once an hour is plenty for dates.
    ttl: 60 * 60,
    url: appUrl + linkPath(buildId, { to: 'target' }),
  });
  const threats = new Map(timeline.threats.map((t) => [t.key, t]));
  for (const item of timeline.items.filter((i) => i.inCalendar)) {
    const threat = threats.get(item.key);
    const description = [
      `${item.detail}.`,
      threat ? `Threatens the target date: ${threat.words}` : null,
      `Build: ${buildName}`,
    ]
      .filter(Boolean)
      .join('\n');
    calendar.createEvent({
      id: `${item.key.replace(':', '-')}@${host}`,
      start: utcDay(item.date),
      end: utcDay(addDays(item.date, 1)),
      allDay: true,
      // The build's day rather than the second: the feed's text, and so its ETag, stays the
      // same between polls until something in it changes (or the day does).
      stamp: utcDay(timeline.today),
      summary: summaries[item.kind](item),
      description,
      url: appUrl + linkPath(buildId, item.link),
    });
  }
  return `${calendar.toString()}\r\n`;
}
