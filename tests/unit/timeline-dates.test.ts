/**
 * The build's calendar: "today" in its time zone and whole-day counts, checked
 * around America/Denver's spring change of 2027. Source of the zone's rules: the
 * IANA time zone database (America/Denver: MST, UTC−7; MDT, UTC−6 from 02:00 on
 * the second Sunday of March — 14 March 2027 — under the US Energy Policy Act of
 * 2005), as shipped with the JavaScript engine's ICU.
 */
import { describe, expect, it } from 'vitest';
import {
  addDays,
  axisToDate,
  buildToday,
  canonicalTimeZone,
  dateToAxis,
  daysBetween,
  isIsoDate,
  isTimeZone,
  todayIn,
  wallClock,
  weekOf,
} from '@shared/dates';

const denver = 'America/Denver';

describe("today in the build's time zone", () => {
  it('is the previous day in Denver until local midnight, before the change (UTC−7)', () => {
    // IANA tz database: 2027-03-14T06:59:59Z is 23:59:59 MST on 13 March.
    expect(todayIn(denver, new Date('2027-03-14T06:59:59Z'))).toBe('2027-03-13');
    expect(todayIn(denver, new Date('2027-03-14T07:00:00Z'))).toBe('2027-03-14');
    expect(todayIn('UTC', new Date('2027-03-14T06:59:59Z'))).toBe('2027-03-14');
  });

  it('turns at 06:00 UTC once daylight time has begun (UTC−6)', () => {
    // IANA tz database: 02:00 MST on 14 March 2027 becomes 03:00 MDT (09:00Z).
    expect(wallClock(new Date('2027-03-14T08:59:00Z'), denver)).toMatchObject({ hour: 1 });
    expect(wallClock(new Date('2027-03-14T09:00:00Z'), denver)).toMatchObject({ hour: 3 });
    expect(todayIn(denver, new Date('2027-03-15T05:59:59Z'))).toBe('2027-03-14');
    expect(todayIn(denver, new Date('2027-03-15T06:00:00Z'))).toBe('2027-03-15');
  });

  it('is remembered within a minute but never across one, even at the change', () => {
    // IANA tz database: 01:59:59.999 MST, then the next millisecond is 03:00 MDT.
    expect(wallClock(new Date('2027-03-14T08:59:00.000Z'), denver)).toMatchObject({ hour: 1 });
    const late = wallClock(new Date('2027-03-14T08:59:59.999Z'), denver);
    expect(late).toMatchObject({ date: '2027-03-14', hour: 1, minute: 59 });
    expect(wallClock(new Date('2027-03-14T09:00:00.000Z'), denver)).toMatchObject({
      hour: 3,
      minute: 0,
    });
    // A caller changing its copy does not change the next answer in the same minute.
    const copy = wallClock(new Date('2027-03-14T08:59:30Z'), denver);
    copy.hour = 99;
    expect(wallClock(new Date('2027-03-14T08:59:45Z'), denver).hour).toBe(1);
    expect(wallClock(new Date('2027-03-14T08:59:30Z'), 'UTC')).toMatchObject({ hour: 8 });
  });

  it('is worked out afresh where an old offset had seconds', () => {
    // IANA tz database: Africa/Monrovia kept −0:44:30 until 1972, so one minute of UTC
    // (12:00:00–12:00:59) spans two minutes of its wall clock, 11:15:30 and 11:16:10.
    expect(wallClock(new Date('1971-01-15T12:00:00Z'), 'Africa/Monrovia')).toMatchObject({
      hour: 11,
      minute: 15,
    });
    expect(wallClock(new Date('1971-01-15T12:00:40Z'), 'Africa/Monrovia')).toMatchObject({
      hour: 11,
      minute: 16,
    });
  });

  it('gives the ISO weekday and hour of the wall clock', () => {
    // 15 March 2027 is a Monday (proleptic Gregorian calendar); 08:00 MDT is 14:00Z.
    expect(wallClock(new Date('2027-03-15T14:00:00Z'), denver)).toEqual({
      date: '2027-03-15',
      hour: 8,
      minute: 0,
      weekday: 1,
    });
  });
});

describe("a build's today and the device's", () => {
  it("is the build's zone's date, and UTC's until the owner chooses a zone", () => {
    // IANA tz database: 2027-03-15T05:30Z is 23:30 MDT on 14 March, after the spring change.
    const late = new Date('2027-03-15T05:30:00Z');
    expect(buildToday({ timeZone: denver }, late)).toBe('2027-03-14');
    expect(buildToday({ timeZone: null }, late)).toBe('2027-03-15');
  });
});

describe('counting days', () => {
  it('counts whole days across the 23-hour day of the change', () => {
    expect(daysBetween('2027-03-10', '2027-03-20')).toBe(10);
    expect(daysBetween('2027-03-14', '2027-03-15')).toBe(1);
    expect(daysBetween('2027-03-20', '2027-03-13')).toBe(-7);
    expect(addDays('2027-03-13', 1)).toBe('2027-03-14');
    expect(addDays('2027-03-20', -7)).toBe('2027-03-13');
    expect(addDays('2028-02-28', 1)).toBe('2028-02-29');
  });

  it('names a week by its Monday (ISO 8601 weeks)', () => {
    expect(weekOf('2027-03-14')).toBe('2027-03-08'); // a Sunday ends the week
    expect(weekOf('2027-03-15')).toBe('2027-03-15');
    expect(weekOf('2027-01-01')).toBe('2026-12-28'); // a week across the new year
  });

  it('knows real calendar dates', () => {
    expect(isIsoDate('2028-02-29')).toBe(true);
    expect(isIsoDate('2027-02-29')).toBe(false);
    expect(isIsoDate('2027-3-1')).toBe(false);
  });
});

describe('time zone names', () => {
  it('takes IANA names and fixes their case from the engine’s list', () => {
    expect(isTimeZone(denver)).toBe(true);
    expect(canonicalTimeZone('america/denver')).toBe(denver);
    expect(canonicalTimeZone('UTC')).toBe('UTC');
  });

  it('refuses unknown zones, offsets and junk', () => {
    for (const bad of ['Mars/Olympus', '+01:00', '', 'America/Denver ', 'x'.repeat(80)]) {
      expect(isTimeZone(bad), bad).toBe(false);
    }
  });
});

describe("a chart's time axis", () => {
  it('places dates on UTC midnights, a day apart even across the 23-hour day of the change', () => {
    // 2027-03-14T00:00:00Z is 1 804 982 400 s after the Unix epoch (20 891 days of 86 400 s).
    expect(dateToAxis('2027-03-14')).toBe(20_891 * 86_400_000);
    expect(dateToAxis('2027-03-15') - dateToAxis('2027-03-14')).toBe(86_400_000);
    expect(axisToDate(dateToAxis('2027-03-14'))).toBe('2027-03-14');
    expect(axisToDate(dateToAxis('2027-03-14') + 86_399_999)).toBe('2027-03-14');
  });
});
