/**
 * Pure formatting and parsing helpers used by the client (and usable by the server).
 * No DOM, no I/O. Money is always an integer count of minor units (cents).
 */

/** Digits after the decimal point for a currency's minor unit (2 for USD, EUR, …; 0 for JPY). */
export function minorUnitDigits(currency: string): number {
  try {
    return (
      new Intl.NumberFormat('en', { style: 'currency', currency }).resolvedOptions()
        .maximumFractionDigits ?? 2
    );
  } catch {
    return 2;
  }
}

/**
 * Formats integer minor units as money in the given currency, e.g. 1850000 USD → "$18,500.00".
 * `display: 'narrowSymbol'` gives "$" for CAD too — only use it where the code is shown beside.
 */
export function formatMoney(
  cents: number,
  currency: string,
  options: { locale?: string; display?: 'symbol' | 'narrowSymbol' | 'code' } = {},
): string {
  const { locale, display = 'symbol' } = options;
  const digits = minorUnitDigits(currency);
  const major = cents / 10 ** digits;
  try {
    return new Intl.NumberFormat(locale, {
      style: 'currency',
      currency,
      currencyDisplay: display,
      minimumFractionDigits: digits,
      maximumFractionDigits: digits,
    }).format(major);
  } catch {
    return `${major.toFixed(digits)} ${currency}`;
  }
}

/**
 * Turns an amount typed in currency units ("18500", "18,500.00", "18 500.5") into integer
 * minor units without going through a float, so "0.29" is exactly 29 and never 28.999….
 * Returns null for an empty string and NaN for anything that is not a plain amount
 * (negative, more decimals than the currency has, letters).
 */
export function parseMoneyToCents(input: string, currency = 'USD'): number | null {
  const digits = minorUnitDigits(currency);
  const text = input
    .trim()
    .replace(/[\s,_]/g, '')
    .replace(/^[$€£]/, '');
  if (text === '') return null;
  const match = /^(\d*)(?:\.(\d*))?$/.exec(text);
  if (!match) return Number.NaN;
  const whole = match[1] ?? '';
  const fraction = match[2] ?? '';
  if (whole === '' && fraction === '') return Number.NaN;
  if (fraction.length > digits) return Number.NaN;
  const wholePart = whole.replace(/^0+(?=\d)/, '') || '0';
  const minor = wholePart + fraction.padEnd(digits, '0');
  const value = Number(minor);
  return Number.isSafeInteger(value) ? value : Number.NaN;
}

/** Integer minor units back to the plain amount a person would type: 1850000 → "18500.00". */
export function centsToInput(cents: number, currency = 'USD'): string {
  const digits = minorUnitDigits(currency);
  if (digits === 0) return String(cents);
  const negative = cents < 0;
  const text = String(Math.abs(cents)).padStart(digits + 1, '0');
  const whole = text.slice(0, text.length - digits);
  const fraction = text.slice(text.length - digits);
  return `${negative ? '-' : ''}${whole}.${fraction}`;
}

/** Splits "YYYY-MM-DD" into numbers; null when it is not a calendar date of that shape. */
function parseIsoDate(iso: string): { y: number; m: number; d: number } | null {
  const match = /^(\d{4})-(\d{2})-(\d{2})$/.exec(iso);
  if (!match) return null;
  const y = Number(match[1]);
  const m = Number(match[2]);
  const d = Number(match[3]);
  const check = new Date(Date.UTC(y, m - 1, d));
  if (check.getUTCFullYear() !== y || check.getUTCMonth() !== m - 1 || check.getUTCDate() !== d) {
    return null;
  }
  return { y, m, d };
}

/** "12 days to go", "1 day to go", "Today", "3 days past". */
export function countdownLabel(days: number): string {
  if (days === 0) return 'Today';
  const n = Math.abs(days);
  const unit = n === 1 ? 'day' : 'days';
  return days > 0 ? `${n} ${unit} to go` : `${n} ${unit} past`;
}

/** A calendar date for people: "30 May 2027" (in the reader's locale), never shifted by time zone. */
export function formatIsoDate(isoDate: string, locale?: string): string {
  const date = parseIsoDate(isoDate);
  if (!date) return isoDate;
  return new Intl.DateTimeFormat(locale, {
    day: 'numeric',
    month: 'short',
    year: 'numeric',
    timeZone: 'UTC',
  }).format(new Date(Date.UTC(date.y, date.m - 1, date.d)));
}

/** A timestamp's calendar date for people, in the reader's time zone. */
export function formatTimestampDate(timestamp: string, locale?: string): string {
  const date = new Date(timestamp);
  if (Number.isNaN(date.getTime())) return timestamp;
  return new Intl.DateTimeFormat(locale, {
    day: 'numeric',
    month: 'short',
    year: 'numeric',
  }).format(date);
}

/** A number with grouping and at most `maxFractionDigits` decimals: 1234.5 → "1,234.5". */
export function formatNumber(value: number, maxFractionDigits = 1, locale?: string): string {
  return new Intl.NumberFormat(locale, { maximumFractionDigits: maxFractionDigits }).format(value);
}
