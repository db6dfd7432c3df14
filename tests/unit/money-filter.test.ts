import { describe, expect, it } from 'vitest';
import { stripMoney } from '@server/lib/money-filter';

describe('stripMoney', () => {
  it('removes every …Cents key at any depth and keeps the rest', () => {
    const body = {
      build: {
        name: 'A',
        budgetCents: 100,
        parts: [{ priceCents: 5, name: 'p', nested: { taxCents: 1, qty: 2 } }],
      },
    };
    expect(stripMoney(body)).toEqual({
      build: { name: 'A', parts: [{ name: 'p', nested: { qty: 2 } }] },
    });
  });

  it('keeps keys on the allow list (a shop sees its own quote)', () => {
    expect(stripMoney({ labourCents: 9, priceCents: 3 }, new Set(['labourCents']))).toEqual({
      labourCents: 9,
    });
  });

  it('leaves scalars, nulls and empty containers alone', () => {
    expect(stripMoney(null)).toBeNull();
    expect(stripMoney(5)).toBe(5);
    expect(stripMoney([])).toEqual([]);
    expect(stripMoney({ percentCentsish: 1 })).toEqual({ percentCentsish: 1 });
  });
});
