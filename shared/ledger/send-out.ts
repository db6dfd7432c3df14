/** Whole days from one ISO date to another (UTC calendar days, no time zone drift). */
export function daysBetween(from: string, to: string): number {
  return Math.round((Date.parse(`${to}T00:00:00Z`) - Date.parse(`${from}T00:00:00Z`)) / 86_400_000);
}

export function addDays(date: string, days: number): string {
  return new Date(Date.parse(`${date}T00:00:00Z`) + days * 86_400_000).toISOString().slice(0, 10);
}

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
