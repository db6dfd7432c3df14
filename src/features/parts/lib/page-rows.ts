/**
 * The ledger lists its rows a step at a time (the browser lays out only what is listed). A step
 * is a number of parts: category header rows do not count, a header is listed only with at
 * least one of its parts under it (or alone when its category is closed), and the list stops
 * before a part, never after a header.
 */
export type PagedRows<T> = {
  rows: T[];
  /** Parts listed. */
  listed: number;
  /** Parts in open categories (or the whole list, ungrouped): what "Show more" can still add. */
  listable: number;
  /** The header whose category the limit cut, with how many of its parts are listed. */
  cut: { header: T; listed: number } | null;
};

export function pageRows<T>(
  rows: readonly T[],
  limit: number,
  isHeader: (row: T) => boolean,
): PagedRows<T> {
  const out: T[] = [];
  let listed = 0;
  let listable = 0;
  let pending: T | null = null; // a header waiting for its first part
  let current: { header: T; listed: number } | null = null;
  let stopped = false;
  let cut: PagedRows<T>['cut'] = null;
  for (const row of rows) {
    if (isHeader(row)) {
      // A header followed straight by another has no rows under it: its category is closed.
      if (pending && !stopped) out.push(pending);
      pending = row;
      current = { header: row, listed: 0 };
      continue;
    }
    listable += 1;
    if (stopped) continue;
    if (listed >= limit) {
      stopped = true;
      // The category was started on this page: its header says how many of its parts are shown.
      if (current && current.listed > 0) cut = current;
      continue;
    }
    if (pending) {
      out.push(pending);
      pending = null;
    }
    out.push(row);
    listed += 1;
    if (current) current.listed += 1;
  }
  if (pending && !stopped) out.push(pending);
  return { rows: out, listed, listable, cut };
}
