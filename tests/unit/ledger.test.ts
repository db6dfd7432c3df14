import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { computeBudget } from '@shared/ledger/budget';
import { coreOwedCents, partTotalCents } from '@shared/ledger/cost';
import { addDays, daysBetween } from '@shared/dates';
import { csvColumnOfField, csvMoneyColumns } from '@shared/ledger/csv';
import { sendOutStatus } from '@shared/ledger/send-out';
import { stampStatusDates } from '@shared/ledger/status-dates';
import { centsToInput, parseMoneyToCents } from '@shared/format';
import type { PartStatus } from '@shared/schemas/parts';

const money = {
  quantity: 1,
  unitPriceCents: 0,
  labourCents: 0,
  shippingCents: 0,
  taxCents: 0,
  coreChargeCents: 0,
  coreRefundCents: 0,
};

describe('money in cents', () => {
  it('parses decimal text exactly, where a float multiply would not', () => {
    expect(parseMoneyToCents('19.99')).toBe(1999); // 19.99 × 100 in floating point is 1998.9999…
    expect(parseMoneyToCents('1,234.5')).toBe(123450);
    expect(parseMoneyToCents('$7')).toBe(700);
    expect(parseMoneyToCents('')).toBeNull();
    expect(parseMoneyToCents('0.29')).toBe(29);
    for (const bad of ['-1', '1.234', 'abc', '1e5', '12.3.4'])
      expect(parseMoneyToCents(bad)).toBeNaN();
  });

  it('round-trips every amount through its plain text', () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 0, max: 99_999_999_999 }),
        (c) => parseMoneyToCents(centsToInput(c)) === c,
      ),
    );
  });
});

describe('part cost', () => {
  it('adds price × quantity, labour, shipping, tax and the unrefunded core', () => {
    const p = {
      quantity: 8,
      unitPriceCents: 42_500,
      labourCents: 1_000,
      shippingCents: 4_000,
      taxCents: 27_200,
      coreChargeCents: 80_000,
      coreRefundCents: 30_000,
    };
    expect(partTotalCents(p)).toBe(340_000 + 1_000 + 4_000 + 27_200 + 50_000);
    expect(coreOwedCents(p)).toBe(50_000);
  });
});

describe('send-outs', () => {
  it('counts days out and marks overdue after the promised turnaround', () => {
    expect(daysBetween('2026-02-27', '2026-03-02')).toBe(3); // across a short February
    expect(addDays('2026-12-25', 10)).toBe('2027-01-04');
    const p = { status: 'at-shop', sentOutOn: '2026-11-01', turnaroundDays: 14 };
    expect(sendOutStatus(p, '2026-11-15')).toEqual({
      daysOut: 14,
      dueOn: '2026-11-15',
      overdue: false,
    });
    expect(sendOutStatus(p, '2026-11-16')).toEqual({
      daysOut: 15,
      dueOn: '2026-11-15',
      overdue: true,
    });
    expect(sendOutStatus({ ...p, status: 'in-hand' }, '2026-11-16')).toBeNull();
    expect(sendOutStatus({ ...p, turnaroundDays: null }, '2026-12-01')).toMatchObject({
      dueOn: null,
      overdue: false,
    });
  });
});

describe('computeBudget', () => {
  const part = (
    id: string,
    status: PartStatus,
    cents: number,
    extra: Partial<typeof money> & { orderedOn?: string } = {},
  ) => ({
    ...money,
    unitPriceCents: cents,
    ...extra,
    id,
    name: id,
    category: 'exhaust' as const,
    status,
    orderedOn: extra.orderedOn ?? null,
    receivedOn: null,
    createdAt: `2026-01-0${id.length}T00:00:00Z`,
  });

  it('counts planned, committed and spent by stage and leaves returned parts out', () => {
    const b = computeBudget(
      [
        part('a', 'planned', 100),
        part('bb', 'ordered', 200),
        part('ccc', 'installed', 400),
        part('dddd', 'returned', 800),
      ],
      1_000,
      'USD',
    );
    expect(b.totals).toMatchObject({
      plannedCents: 700,
      committedCents: 600,
      spentCents: 400,
      partCount: 3,
    });
    expect(b.remainingAfterPlannedCents).toBe(300);
    expect(b.overBudget).toBe(false);
    expect(b.tippingPart).toBeNull();
  });

  it('names the part that crosses the budget, money already spent counted first', () => {
    const b = computeBudget(
      [part('a', 'planned', 500), part('bb', 'installed', 600), part('ccc', 'ordered', 300)],
      1_000,
      'USD',
    );
    expect(b.overBudget).toBe(true);
    // installed 600, then ordered 300 (900), then planned 500 → crosses.
    expect(b.tippingPart).toEqual({ id: 'a', name: 'a', overByCents: 400 });
  });

  it('with no budget set (zero), nothing is over it and no part is named', () => {
    const b = computeBudget([part('a', 'installed', 600), part('bb', 'planned', 300)], 0, 'USD');
    expect(b.overBudget).toBe(false);
    expect(b.tippingPart).toBeNull();
    expect(b.totals.plannedCents).toBe(900);
  });

  it('builds a cumulative spending line by date', () => {
    const b = computeBudget(
      [
        part('a', 'ordered', 100, { orderedOn: '2026-02-01' }),
        part('bb', 'installed', 50, { orderedOn: '2026-01-01' }),
      ],
      1_000,
      'USD',
    );
    expect(b.spendingOverTime).toEqual([
      { date: '2026-01-01', committedCents: 50, spentCents: 50 },
      { date: '2026-02-01', committedCents: 150, spentCents: 50 },
    ]);
  });

  it('planned ≥ committed ≥ spent for any ledger', () => {
    const statuses: PartStatus[] = [
      'planned',
      'ordered',
      'in-hand',
      'at-shop',
      'installed',
      'returned',
    ];
    fc.assert(
      fc.property(
        fc.array(fc.tuple(fc.constantFrom(...statuses), fc.integer({ min: 0, max: 1e7 })), {
          maxLength: 40,
        }),
        (rows) => {
          const b = computeBudget(
            rows.map(([s, c], i) => part(`p${i}`, s, c)),
            5e7,
            'USD',
          );
          return (
            b.totals.plannedCents >= b.totals.committedCents &&
            b.totals.committedCents >= b.totals.spentCents
          );
        },
      ),
    );
  });
});

describe('status changes stamp their date (issue #14)', () => {
  const today = '2026-12-02';
  const part = {
    status: 'ordered' as PartStatus,
    orderedOn: '2026-11-20',
    expectedOn: null,
    receivedOn: null,
    sentOutOn: null,
    backOn: null,
    installedOn: null,
  };

  it('fills the date of the new status when it is empty', () => {
    expect(stampStatusDates(part, { status: 'in-hand' }, today)).toEqual({
      status: 'in-hand',
      receivedOn: today,
    });
    expect(
      stampStatusDates({ ...part, status: 'in-hand' }, { status: 'installed' }, today),
    ).toEqual({ status: 'installed', installedOn: today });
    // A new part starts as planned: created as ordered, it is ordered today.
    expect(stampStatusDates(null, { status: 'ordered' }, today)).toEqual({
      status: 'ordered',
      orderedOn: today,
    });
    // An empty box sent with the change (null) is filled like a missing one.
    expect(stampStatusDates(part, { status: 'in-hand', receivedOn: null }, today)).toEqual({
      status: 'in-hand',
      receivedOn: today,
    });
  });

  it('records the part back when it leaves a shop', () => {
    const atShop = { ...part, status: 'at-shop' as PartStatus, sentOutOn: '2026-11-25' };
    expect(stampStatusDates(atShop, { status: 'in-hand' }, today)).toEqual({
      status: 'in-hand',
      receivedOn: today,
      backOn: today,
    });
  });

  it('keeps a date the caller gave, and stamps nothing without a change of status', () => {
    expect(stampStatusDates(part, { status: 'in-hand', receivedOn: '2026-11-30' }, today)).toEqual({
      status: 'in-hand',
      receivedOn: '2026-11-30',
    });
    expect(stampStatusDates(part, { status: 'ordered' }, today)).toEqual({ status: 'ordered' });
    expect(stampStatusDates(part, { notes: 'x' }, today)).toEqual({ notes: 'x' });
  });

  it('leaves out a stamp that would put the dates out of order', () => {
    // Ordered on a later day than "today" (a clock behind, a typo): received today would be
    // before the order, so the status changes and the date stays empty.
    const future = { ...part, orderedOn: '2027-01-10' };
    expect(stampStatusDates(future, { status: 'in-hand' }, today)).toEqual({ status: 'in-hand' });
    // Installed on an earlier day: received today would come after it.
    const installed = {
      ...part,
      status: 'planned' as PartStatus,
      orderedOn: null,
      installedOn: '2026-11-01',
    };
    expect(stampStatusDates(installed, { status: 'in-hand' }, today)).toEqual({
      status: 'in-hand',
    });
  });
});

// The parts CSV's money columns: the README's CSV section names them unitPrice, labour,
// shipping, tax, coreCharge and coreRefund, each a decimal amount read into the part's cents.
describe('the parts CSV columns', () => {
  it('names the column a refused field came from', () => {
    expect(csvColumnOfField('unitPriceCents')).toBe('unitPrice');
    expect(csvColumnOfField('coreRefundCents')).toBe('coreRefund');
    expect(csvColumnOfField('shopUserId')).toBe('shopEmail');
    expect(csvColumnOfField('name')).toBe('name');
  });

  it('holds every cents field of a part that the ledger form edits', () => {
    expect(Object.values(csvMoneyColumns).sort()).toEqual([
      'coreChargeCents',
      'coreRefundCents',
      'labourCents',
      'shippingCents',
      'taxCents',
      'unitPriceCents',
    ]);
  });
});
