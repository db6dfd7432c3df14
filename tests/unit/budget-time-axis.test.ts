import { describe, expect, it } from 'vitest';
import { dayTime, formatTick, timeDomain, timeTicks } from '@/features/budget/lib/time-axis';

const day = 86_400_000;
const iso = (t: number) => new Date(t).toISOString().slice(0, 10);

describe('the spending chart’s time axis', () => {
  it('places dates by their distance in days, not one after another', () => {
    const times = ['2026-01-01', '2026-01-03', '2026-03-01'].map(dayTime);
    expect((times[1] - times[0]) / day).toBe(2);
    expect((times[2] - times[1]) / day).toBe(57);
    expect(timeDomain(times)).toEqual([times[0], times[2]]);
  });

  it('ticks on the first of each month over a few months, evenly in time', () => {
    const { ticks, unit } = timeTicks(dayTime('2026-01-01'), dayTime('2026-04-20'));
    expect(unit).toBe('month');
    expect(ticks.map(iso)).toEqual(['2026-01-01', '2026-02-01', '2026-03-01', '2026-04-01']);
    expect(formatTick(ticks[1], unit)).toBe('Feb 2026');
  });

  it('ticks every week over a few weeks, and every day over a few days', () => {
    const weeks = timeTicks(dayTime('2026-01-01'), dayTime('2026-02-05'));
    expect(weeks.unit).toBe('day');
    const gaps = weeks.ticks.slice(1).map((t, i) => (t - weeks.ticks[i]) / day);
    expect(new Set(gaps)).toEqual(new Set([7]));
    const days = timeTicks(dayTime('2026-01-01'), dayTime('2026-01-04'));
    expect(days.ticks.map(iso)).toEqual(['2026-01-01', '2026-01-02', '2026-01-03', '2026-01-04']);
    expect(formatTick(days.ticks[2], 'day')).toBe('Jan 3');
  });

  it('gives a single date a day either side', () => {
    const t = dayTime('2026-05-10');
    expect(timeDomain([t])).toEqual([t - day, t + day]);
  });

  it('keeps to a handful of ticks over years', () => {
    const { ticks } = timeTicks(dayTime('2024-01-15'), dayTime('2026-11-02'));
    expect(ticks.length).toBeLessThanOrEqual(6);
    expect(ticks.every((t) => iso(t).endsWith('-01'))).toBe(true);
  });
});
