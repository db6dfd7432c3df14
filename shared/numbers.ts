/**
 * The one reader of numbers a person types, used by every number box on the client (and
 * usable by the server). Pure: no DOM, no locale lookup.
 *
 * Headroom's screens speak US English, so a comma normally groups thousands. The rule:
 * - `1,250`, `12,345.6` — a comma followed by groups of exactly three digits, the first group
 *   not starting with a lone 0, groups thousands: 1250 and 12345.6.
 * - `12,5`, `0,250`, `1234,5`, `,5` — any other single comma with no point is a decimal comma:
 *   12.5, 0.25, 1234.5, 0.5. (So `1,250` is one thousand two hundred and fifty, never 1.25.)
 * - `1.250,5` (points grouping, comma decimal) or more than one decimal mark is refused.
 * - Spaces around the number are ignored; a leading `-`, `+` or `−` (U+2212) sets the sign;
 *   `.5` is 0.5 and `12.` is 12.
 * - An empty box is "no number" (null). Anything else (letters, `1e3`, `Infinity`) is an error.
 */

/** What `readNumber` makes of a box's text. */
export type NumberReading =
  { ok: true; value: number | null } | { ok: false; value: number; error: string };

/** The message for text that is not a number. */
export const notANumberMessage = 'Enter a number, like 1250 or 12.5';

const grouped = /^[1-9]\d{0,2}(?:,\d{3})+(?:\.\d*)?$/;
const plain = /^(?:\d+\.?\d*|\.\d+)$/;
const decimalComma = /^(?:\d+,\d*|,\d+)$/;

/** Reads typed text (or a number already read) into a number, null for empty, or an error. */
export function readNumber(input: unknown): NumberReading {
  if (input === null || input === undefined) return { ok: true, value: null };
  if (typeof input === 'number') {
    return Number.isFinite(input)
      ? { ok: true, value: input }
      : { ok: false, value: Number.NaN, error: notANumberMessage };
  }
  let text = String(input).trim();
  if (text === '') return { ok: true, value: null };
  let sign = 1;
  if (/^[-+\u2212]/.test(text)) {
    if (text[0] !== '+') sign = -1;
    text = text.slice(1).trimStart();
  }
  let normal: string | null = null;
  if (plain.test(text)) normal = text;
  else if (grouped.test(text)) normal = text.replaceAll(',', '');
  else if (decimalComma.test(text)) normal = text.replace(',', '.');
  if (normal === null || normal === '.') {
    return { ok: false, value: Number.NaN, error: notANumberMessage };
  }
  const value = sign * Number(normal);
  // -0 reads as 0: nobody means a signed zero.
  return { ok: true, value: value === 0 ? 0 : value };
}

/**
 * The form-friendly reading: the number, null for an empty box, NaN for text that is not a
 * number (so the field's zod schema names the problem in its own words). Fits
 * react-hook-form's `register(name, { setValueAs: parseNumber })`.
 */
export function parseNumber(input: unknown): number | null {
  return readNumber(input).value;
}

/** A number back into a box's text: empty for none, no grouping, so it reads back the same. */
export function numberToInput(value: number | null | undefined): string {
  return value == null || Number.isNaN(value) ? '' : String(value);
}
