/**
 * A time axis for the budget's "spending over time" chart: dates placed by their distance
 * in days (a gap of two months looks like two months, not like the next day), with ticks on
 * round days — every day, every few days, every week, or on the first of the month.
 */
import { addDays, axisToDate, dateToAxis, daysBetween } from '@shared/dates';

/** A YYYY-MM-DD date as the chart's x value (shared/dates dateToAxis). */
export const dayTime = dateToAxis;

/** The axis value `days` after `t` (days counted on calendar dates). */
const shift = (t: number, days: number) => dateToAxis(addDays(axisToDate(t), days));

/** The axis runs from the first date to the last; a single date gets a day either side. */
export function timeDomain(times: number[]): [number, number] {
  const min = Math.min(...times);
  const max = Math.max(...times);
  return min === max ? [shift(min, -1), shift(max, 1)] : [min, max];
}

/** Month starts (UTC) from the first inside [min, max], every `months` months. */
function monthTicks(min: number, max: number, months: number): number[] {
  const d = new Date(min);
  let y = d.getUTCFullYear();
  let m = d.getUTCMonth() + (d.getUTCDate() === 1 && d.getUTCHours() === 0 ? 0 : 1);
  const out: number[] = [];
  for (;;) {
    const t = Date.UTC(y + Math.floor(m / 12), m % 12, 1);
    if (t > max) break;
    out.push(t);
    m += months;
    if (m >= 12) {
      y += Math.floor(m / 12);
      m %= 12;
    }
  }
  return out;
}

export type TimeTicks = { ticks: number[]; unit: 'day' | 'month' };

/** At most about `target` ticks on round days, evenly spaced in time. */
export function timeTicks(min: number, max: number, target = 6): TimeTicks {
  const spanDays = daysBetween(axisToDate(min), axisToDate(max));
  for (const step of [1, 2, 7, 14]) {
    if (spanDays / step <= target) {
      // The first midnight at or after min.
      const first = dateToAxis(axisToDate(min)) < min ? shift(min, 1) : min;
      const ticks: number[] = [];
      for (let t = first; t <= max; t = shift(t, step)) ticks.push(t);
      return { ticks, unit: 'day' };
    }
  }
  for (const months of [1, 2, 3, 6, 12]) {
    const ticks = monthTicks(min, max, months);
    if (ticks.length <= target) return { ticks, unit: 'month' };
  }
  return { ticks: monthTicks(min, max, 24), unit: 'month' };
}

const dayFormat = new Intl.DateTimeFormat('en-US', {
  month: 'short',
  day: 'numeric',
  timeZone: 'UTC',
});
const monthFormat = new Intl.DateTimeFormat('en-US', {
  month: 'short',
  year: 'numeric',
  timeZone: 'UTC',
});

/** "Jan 5" on a day axis, "Jan 2026" on a month axis. */
export function formatTick(t: number, unit: TimeTicks['unit']): string {
  return (unit === 'month' ? monthFormat : dayFormat).format(new Date(t));
}
