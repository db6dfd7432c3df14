/** A moment as mails show it: "9 December 2026, 14:05 UTC" — mails do not know the reader's time zone. */
export function mailDateTime(d: Date): string {
  return `${new Intl.DateTimeFormat('en-GB', { dateStyle: 'long', timeStyle: 'short', timeZone: 'UTC' }).format(d)} UTC`;
}

/** “Quoted” as mails quote names. */
export const quoted = (s: string) => `“${s}”`;
