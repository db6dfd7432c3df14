import { addDays, daysBetween } from '@shared/dates';

/**
 * A part out at a shop: days it has been away, the date it was promised back
 * (sent-out date + turnaround) and whether today is past that date.
 */
export function sendOutStatus(
  p: { status: string; sentOutOn: string | null; turnaroundDays: number | null },
  today: string,
): { daysOut: number; dueOn: string | null; overdue: boolean } | null {
  if (p.status !== 'at-shop' || !p.sentOutOn) return null;
  const daysOut = Math.max(0, daysBetween(p.sentOutOn, today));
  const dueOn = p.turnaroundDays != null ? addDays(p.sentOutOn, p.turnaroundDays) : null;
  return { daysOut, dueOn, overdue: dueOn != null && today > dueOn };
}
