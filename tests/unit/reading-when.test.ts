/** A reading sent late from the offline queue shows when it was taken and when it arrived. */
import { describe, expect, it } from 'vitest';
import { readingWhen } from '@/features/install-log/lib/format';

const hhmm = (iso: string) => iso.slice(11, 16);

describe('readingWhen', () => {
  it('shows one time for a reading that arrived as it was taken', () => {
    const at = '2026-03-12T10:42:00.000Z';
    expect(readingWhen({ takenAt: at, recordedAt: at }, hhmm)).toBe('10:42');
  });

  it('shows one time when it arrived within the minute', () => {
    expect(
      readingWhen(
        { takenAt: '2026-03-12T10:42:00.000Z', recordedAt: '2026-03-12T10:42:59.000Z' },
        hhmm,
      ),
    ).toBe('10:42');
  });

  it('shows both times for a reading sent late', () => {
    expect(
      readingWhen(
        { takenAt: '2026-03-12T10:42:00.000Z', recordedAt: '2026-03-12T11:15:00.000Z' },
        hhmm,
      ),
    ).toBe('taken 10:42, arrived 11:15');
  });
});
