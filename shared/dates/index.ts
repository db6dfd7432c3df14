/**
 * Calendar dates in a build's time zone: the one place Headroom turns a moment
 * into "today" and counts days. Pure: only `Intl.DateTimeFormat` with a
 * `timeZone` (the IANA database that ships with the JavaScript engine), no
 * date library.
 *
 * Dates are `YYYY-MM-DD` strings end to end. Arithmetic on them runs on UTC
 * midnights, where every day is 24 hours long, so a daylight-saving change in
 * the build's zone can never add or lose a day: the zone decides only which
 * date "today" is.
 */

/** A calendar date, `YYYY-MM-DD`. */
export type IsoDate = string;

const dayMs = 86_400_000;

/** The zone a build uses until its owner chooses one. */
export const fallbackTimeZone = 'UTC';

/** One formatter per zone: building them is the slow part of Intl. */
const formatters = new Map<string, Intl.DateTimeFormat>();

function formatterFor(timeZone: string): Intl.DateTimeFormat {
  let f = formatters.get(timeZone);
  if (!f) {
    f = new Intl.DateTimeFormat('en-US', {
      timeZone,
      calendar: 'gregory',
      numberingSystem: 'latn',
      year: 'numeric',
      month: '2-digit',
      day: '2-digit',
      hour: '2-digit',
      minute: '2-digit',
      weekday: 'short',
      hourCycle: 'h23',
    });
    formatters.set(timeZone, f);
  }
  return f;
}

// IANA names are words joined by slashes ("America/Denver", "Etc/GMT+7", "UTC"); engines also
// take offsets like "+01:00", which follow no daylight-saving rules and are not accepted here.
const ianaShape = /^[A-Za-z][A-Za-z0-9_+-]*(?:\/[A-Za-z0-9_+-]+)*$/;

/**
 * The name as Headroom stores it, or null when this engine does not know the zone. The name is
 * kept as given (engines disagree on aliases: "Asia/Kolkata" is "Asia/Calcutta" to some), with
 * its letters' case taken from the engine's list when it is there ("america/denver" →
 * "America/Denver").
 */
export function canonicalTimeZone(name: string): string | null {
  if (typeof name !== 'string' || name.length > 64 || !ianaShape.test(name)) return null;
  try {
    new Intl.DateTimeFormat('en-US', { timeZone: name });
  } catch {
    return null;
  }
  const lower = name.toLowerCase();
  return knownZones().find((z) => z.toLowerCase() === lower) ?? name;
}

let zones: string[] | undefined;
/** The engine's list of zones, with UTC (which the list leaves out), for pickers and spelling. */
export function knownZones(): string[] {
  zones ??= [
    'UTC',
    ...(typeof Intl.supportedValuesOf === 'function' ? Intl.supportedValuesOf('timeZone') : []),
  ];
  return zones;
}

/** Whether `name` is an IANA time zone this engine knows. */
export function isTimeZone(name: string): boolean {
  return canonicalTimeZone(name) !== null;
}

const weekdays: Record<string, number> = { Mon: 1, Tue: 2, Wed: 3, Thu: 4, Fri: 5, Sat: 6, Sun: 7 };

type WallClock = { date: IsoDate; hour: number; minute: number; weekday: number };

/**
 * The last wall clock worked out per zone, with the minute it is for. Every build read
 * asks for its "today", and formatToParts costs about 30 µs a call; within one minute of
 * the epoch the answer cannot change, since every zone's offset is whole minutes from
 * 1972 on (older local mean times had seconds, e.g. Amsterdam's +0:19:32: those instants
 * are worked out every time).
 */
const wholeMinuteOffsetsSince = Date.UTC(1972, 6, 1);
const lastWallClock = new Map<string, { minute: number; clock: WallClock }>();

/** The wall clock in a zone at a moment: its date, hour (0–23), minute and ISO weekday (1 = Monday). */
export function wallClock(instant: Date, timeZone: string): WallClock {
  const minute = Math.floor(instant.getTime() / 60_000);
  const remembered = instant.getTime() >= wholeMinuteOffsetsSince;
  const last = remembered ? lastWallClock.get(timeZone) : undefined;
  if (last?.minute === minute) return { ...last.clock };
  const parts: Record<string, string> = {};
  for (const p of formatterFor(timeZone).formatToParts(instant)) parts[p.type] = p.value;
  const clock = {
    date: `${parts.year}-${parts.month}-${parts.day}`,
    hour: Number(parts.hour),
    minute: Number(parts.minute),
    weekday: weekdays[parts.weekday],
  };
  if (remembered) lastWallClock.set(timeZone, { minute, clock });
  return { ...clock };
}

/** The calendar date in a zone at a moment: what "today" is for the build. */
export function todayIn(timeZone: string, now: Date = new Date()): IsoDate {
  return wallClock(now, timeZone).date;
}

/**
 * A build's "today": the calendar date in its time zone, or in UTC until its owner chooses one.
 * Every date a build's pages and services stamp or judge against ("ordered today", "overdue",
 * "Yesterday" in the activity) is this one, on the server and in the browser alike.
 */
export function buildToday(build: { timeZone: string | null }, now: Date = new Date()): IsoDate {
  return todayIn(build.timeZone ?? fallbackTimeZone, now);
}

/** This device's IANA time zone, when the engine names one Headroom accepts. */
export function deviceTimeZone(): string | undefined {
  try {
    const zone = Intl.DateTimeFormat().resolvedOptions().timeZone;
    return zone && isTimeZone(zone) ? zone : undefined;
  } catch {
    return undefined;
  }
}

/**
 * "Today" for what belongs to a person rather than a build (their own wrenches): the date on
 * this device, or in UTC when it names no zone.
 */
export function deviceToday(now: Date = new Date()): IsoDate {
  return todayIn(deviceTimeZone() ?? fallbackTimeZone, now);
}

function utcMidnight(date: IsoDate): number {
  return Date.parse(`${date}T00:00:00Z`);
}

/** Whether `s` is a real calendar date written `YYYY-MM-DD`. */
export function isIsoDate(s: string): boolean {
  if (!/^\d{4}-\d{2}-\d{2}$/.test(s)) return false;
  const t = utcMidnight(s);
  return !Number.isNaN(t) && new Date(t).toISOString().slice(0, 10) === s;
}

/** Whole days from one date to another: 1 from today to tomorrow, negative backwards. */
export function daysBetween(from: IsoDate, to: IsoDate): number {
  return Math.round((utcMidnight(to) - utcMidnight(from)) / dayMs);
}

/** The date `days` after `date` (before it when negative). */
export function addDays(date: IsoDate, days: number): IsoDate {
  return new Date(utcMidnight(date) + days * dayMs).toISOString().slice(0, 10);
}

/**
 * A date as a number on a chart's continuous time axis: the milliseconds of its UTC midnight,
 * so every day is the same width and gaps between dates look as long as they are.
 */
export function dateToAxis(date: IsoDate): number {
  return utcMidnight(date);
}

/** The date a time-axis value falls on (the inverse of dateToAxis). */
export function axisToDate(t: number): IsoDate {
  return new Date(t).toISOString().slice(0, 10);
}

/** The later of two dates. */
export function laterOf(a: IsoDate, b: IsoDate): IsoDate {
  return a > b ? a : b;
}

/** The ISO weekday of a date: 1 Monday … 7 Sunday. */
export function weekdayOf(date: IsoDate): number {
  return ((new Date(utcMidnight(date)).getUTCDay() + 6) % 7) + 1;
}

/** The Monday of the week (ISO 8601: weeks start on Monday) holding `date`: the week's name. */
export function weekOf(date: IsoDate): IsoDate {
  return addDays(date, 1 - weekdayOf(date));
}

/** A date for mails and calendars in US English: "Sat, May 30, 2027" (never shifted by a zone). */
export function longDate(date: IsoDate): string {
  return new Intl.DateTimeFormat('en-US', {
    weekday: 'short',
    month: 'short',
    day: 'numeric',
    year: 'numeric',
    timeZone: 'UTC',
  }).format(new Date(utcMidnight(date)));
}

/** A short date in US English: "May 30". */
export function shortDate(date: IsoDate): string {
  return new Intl.DateTimeFormat('en-US', {
    month: 'short',
    day: 'numeric',
    timeZone: 'UTC',
  }).format(new Date(utcMidnight(date)));
}

/** "1 day", "5 days". */
export function dayCount(n: number): string {
  const abs = Math.abs(n);
  return `${abs} ${abs === 1 ? 'day' : 'days'}`;
}
