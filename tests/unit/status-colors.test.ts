/**
 * Warning colors are for warnings (issue 20): a part in the garage or out at a shop, and a
 * step under way, are ordinary states and must not wear the brand orange (accent) or the
 * amber and red of "tight" and "over".
 */
import { describe, expect, it } from 'vitest';
import { partStatuses } from '@shared/schemas/parts';
import { statusTone } from '@/features/parts/lib/status';

const warningLooks =
  /\b(?:[a-z-]+-)?(?:tight|over|accent)(?:-[a-z0-9]+)?\b|#6b4408|#7d1f17|#a76a0c|#b93226/;

describe('part status colors', () => {
  it('keep every state clear of the warning and brand colors', () => {
    for (const status of partStatuses) {
      expect(statusTone[status], status).not.toMatch(warningLooks);
    }
  });

  it('give in the garage and out at a shop looks of their own', () => {
    expect(statusTone['in-hand']).not.toBe(statusTone['at-shop']);
    expect(new Set(partStatuses.map((s) => statusTone[s])).size).toBe(partStatuses.length);
  });
});
