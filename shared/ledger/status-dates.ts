import {
  partConsistencyIssues,
  type PartFields,
  type PartStatus,
  type UpdatePartInput,
} from '@shared/schemas/parts';

type DateField = 'orderedOn' | 'receivedOn' | 'sentOutOn' | 'backOn' | 'installedOn';
type PartDates = Partial<Pick<PartFields, 'status' | 'expectedOn' | DateField>>;

/** The date a part's status records: moving to it fills that date, when still empty. */
export const statusDateField: Partial<Record<PartStatus, DateField>> = {
  ordered: 'orderedOn',
  'in-hand': 'receivedOn',
  'at-shop': 'sentOutOn',
  installed: 'installedOn',
};

/**
 * The change with the date stamps its status change implies: today in the date of the new
 * status (ordered on, received on, sent out on, installed on) when that date is still empty
 * after the change, and the back-on date when a part leaves a shop. A stamp is left out when
 * it would put the part's dates out of order, so a status change never fails on a date nobody
 * typed. `before` is the stored part (null when the part is new, which starts as planned);
 * `today` is a YYYY-MM-DD date, the caller's own (the browser's local day, the server's UTC
 * day). The one rule for every path: the ledger row, the part form, the API and CSV import.
 */
export function stampStatusDates<T extends UpdatePartInput>(
  before: PartDates | null,
  change: T,
  today: string,
): T {
  const from = before?.status ?? 'planned';
  const to = change.status;
  if (!to || (before && to === from)) return change;
  const merged = (field: DateField) => (field in change ? change[field] : before?.[field]);
  const stamps: DateField[] = [];
  const field = statusDateField[to];
  if (field && !merged(field)) stamps.push(field);
  if (from === 'at-shop' && to !== 'at-shop' && merged('sentOutOn') && !merged('backOn')) {
    stamps.push('backOn');
  }
  // A stamp is kept only if it adds no contradiction of its own; one the caller typed is
  // still the caller's to fix.
  const known = new Set(Object.keys(partConsistencyIssues({ ...before, ...change })));
  const stamped: T = { ...change };
  for (const f of stamps) {
    const issues = Object.keys(partConsistencyIssues({ ...before, ...stamped, [f]: today }));
    if (issues.every((k) => known.has(k))) stamped[f] = today;
  }
  return stamped;
}
