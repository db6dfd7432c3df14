import { describe, expect, it } from 'vitest';
import { pageRows } from '@/features/parts/lib/page-rows';

type R = { header: string } | { part: string };
const isHeader = (r: R) => 'header' in r;

/** A grouped ledger as the table lists it: each category's header, then its parts. */
function grouped(sizes: Record<string, number>, closed: string[] = []): R[] {
  const rows: R[] = [];
  for (const [category, n] of Object.entries(sizes)) {
    rows.push({ header: category });
    if (closed.includes(category)) continue;
    for (let i = 1; i <= n; i += 1) rows.push({ part: `${category}-${i}` });
  }
  return rows;
}

const parts = (rows: R[]) => rows.filter((r) => !isHeader(r));

describe('the parts ledger lists parts a step at a time (issue #14)', () => {
  it('lists every part of a 32-part build under 12 category headers: headers do not count', () => {
    // 32 parts in 12 categories: 44 rows, more than the 40 a step lists.
    const rows = grouped({
      a: 6,
      b: 4,
      c: 3,
      d: 3,
      e: 2,
      f: 2,
      g: 2,
      h: 2,
      i: 2,
      j: 2,
      k: 2,
      l: 2,
    });
    expect(rows).toHaveLength(44);
    const page = pageRows(rows, 40, isHeader);
    expect(page.listed).toBe(32);
    expect(parts(page.rows)).toHaveLength(32);
    expect(page.rows).toHaveLength(44);
    expect(page.listable - page.listed).toBe(0);
    expect(page.cut).toBeNull();
  });

  it('counts hidden parts, not rows, and never leaves a header without a part under it', () => {
    // 45 parts: the step stops after the 40th part; 5 are left for "Show more".
    const rows = grouped({ a: 20, b: 19, c: 3, d: 3 });
    const page = pageRows(rows, 40, isHeader);
    expect(page.listed).toBe(40);
    expect(page.listable - page.listed).toBe(5);
    // a (20) + b (19) + the first part of c: c's header comes with that part, d's not at all.
    expect(page.rows.at(-1)).toEqual({ part: 'c-1' });
    expect(page.rows.filter(isHeader)).toEqual([{ header: 'a' }, { header: 'b' }, { header: 'c' }]);
    expect(page.cut).toEqual({ header: { header: 'c' }, listed: 1 });
    // When the step ends exactly at a category's end, the next header is not listed alone.
    const exact = pageRows(grouped({ a: 20, b: 20, c: 4 }), 40, isHeader);
    expect(exact.rows.at(-1)).toEqual({ part: 'b-20' });
    expect(exact.rows.filter(isHeader)).toHaveLength(2);
    expect(exact.cut).toBeNull();
  });

  it('lists a closed category as its header alone, before the step ends', () => {
    const rows = grouped({ a: 10, b: 8, c: 30 }, ['b']);
    const page = pageRows(rows, 40, isHeader);
    expect(page.rows.filter(isHeader)).toEqual([{ header: 'a' }, { header: 'b' }, { header: 'c' }]);
    expect(page.listed).toBe(40);
    expect(page.listable).toBe(40); // b's parts are closed, not waiting for "Show more"
  });

  it('lists 150 parts ungrouped 40 at a time', () => {
    const rows: R[] = Array.from({ length: 150 }, (_, i) => ({ part: `p${i}` }));
    const first = pageRows(rows, 40, isHeader);
    expect(first.rows).toHaveLength(40);
    expect(first.listable - first.listed).toBe(110);
    expect(pageRows(rows, 160, isHeader).rows).toHaveLength(150);
  });
});
