/**
 * Money as integer minor units. Parsing goes through the decimal string, never a
 * float multiply, so "19.99" is exactly 1999 cents (19.99 * 100 is 1998.9999…).
 */

/** "1,234.5" → 123450; null when the text is not a plain non-negative amount with ≤ 2 decimals. */
export function parseMoneyToCents(text: string): number | null {
  const clean = text.trim().replace(/[,\s]/g, '').replace(/^\$/, '');
  if (clean === '') return 0;
  const m = /^(\d{1,12})(?:\.(\d{0,2}))?$/.exec(clean);
  if (!m) return null;
  const whole = Number(m[1]);
  const frac = Number((m[2] ?? '').padEnd(2, '0'));
  return whole * 100 + frac;
}

/** 123450 → "1234.50": a plain amount for CSV and form fields. */
export function centsToPlain(cents: number): string {
  const sign = cents < 0 ? '-' : '';
  const abs = Math.abs(cents);
  return `${sign}${Math.floor(abs / 100)}.${String(abs % 100).padStart(2, '0')}`;
}
