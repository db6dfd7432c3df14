/**
 * A moment as mails show it, in US English like the rest of Headroom: "December 9, 2026 at
 * 2:05 PM UTC" — mails do not know the reader's time zone.
 */
export function mailDateTime(d: Date): string {
  return `${new Intl.DateTimeFormat('en-US', { dateStyle: 'long', timeStyle: 'short', timeZone: 'UTC' }).format(d)} UTC`;
}

/** A calendar date (YYYY-MM-DD) as mails show it: "December 9, 2026". */
export function mailDate(isoDate: string): string {
  return new Intl.DateTimeFormat('en-US', { dateStyle: 'long', timeZone: 'UTC' }).format(
    new Date(`${isoDate}T00:00:00Z`),
  );
}

/** “Quoted” as mails quote names. */
export const quoted = (s: string) => `“${s}”`;
