/**
 * The ledger as CSV: one row a part, money as plain decimal amounts in the
 * build's currency, categories/statuses/units by their ids (labels accepted on
 * import), the shop by its member's e-mail.
 */
import Papa from 'papaparse';
import { centsToInput, parseMoneyToCents } from '@shared/format';
import { csvMoneyColumns } from '@shared/ledger/csv';
import {
  partCategories,
  partCategoryLabels,
  partStatuses,
  partStatusLabels,
  ratingUnits,
  ratingUnitLabels,
} from '@shared/schemas/parts';
import type { PartRecord } from './parts.repository';

export const csvColumns = [
  'category',
  'name',
  'vendor',
  'partNumber',
  'quantity',
  'status',
  'shopEmail',
  'turnaroundDays',
  'unitPrice',
  'labour',
  'shipping',
  'tax',
  'coreCharge',
  'coreRefund',
  'orderedOn',
  'expectedOn',
  'receivedOn',
  'sentOutOn',
  'backOn',
  'installedOn',
  'ratingValue',
  'ratingUnit',
  'ratingFor',
  'notes',
] as const;
type CsvColumn = (typeof csvColumns)[number];
const dateColumns = [
  'orderedOn',
  'expectedOn',
  'receivedOn',
  'sentOutOn',
  'backOn',
  'installedOn',
] as const;

/**
 * A cell a spreadsheet could run as a formula: one whose first character, or
 * first after spaces, is = + - @ (or their full-width forms), or that starts
 * with a tab, carriage return or line feed (OWASP, "CSV Injection").
 */
const formulaLike = /^(?:[\t\r\n]|\s*[=+\-@\uFF1D\uFF0B\uFF0D\uFF20])/;

/** Stops a spreadsheet from running a cell as a formula: a leading ' makes it text. */
export function safeCell(value: string) {
  return formulaLike.test(value) ? `'${value}` : value;
}

/** Undoes safeCell on import, so a round trip gives back what was exported. */
export function unsafeCell(value: string) {
  return value.startsWith("'") && formulaLike.test(value.slice(1)) ? value.slice(1) : value;
}

/**
 * The export's file name: the build's name and the day, so two exports (or two builds) do not
 * arrive as parts.csv and parts (1).csv. Letters of any script are kept (the header carries
 * them as UTF-8); anything else between them becomes one hyphen.
 */
export function csvFileName(buildName: string, date: string): string {
  const slug = buildName
    .normalize('NFKC')
    .toLowerCase()
    .replace(/[^\p{L}\p{N}]+/gu, '-')
    .replace(/^-+|-+$/g, '')
    .slice(0, 80)
    .replace(/-+$/, '');
  return `${slug || 'build'}-parts-${date}.csv`;
}

/**
 * A UTF-8 byte-order mark: without it, spreadsheet programs (Excel above all) read the file as
 * their local code page and show °, — and ³ as mojibake. parseCsv strips it again.
 */
export const UTF8_BOM = '\uFEFF';

export function partsToCsv(
  parts: PartRecord[],
  opts: { withMoney: boolean; shopEmails: Map<string, string> },
) {
  const columns = csvColumns.filter((c) => opts.withMoney || !(c in csvMoneyColumns));
  const rows = parts.map((p) =>
    columns.map((c): string => {
      if (c in csvMoneyColumns)
        return centsToInput(p[csvMoneyColumns[c as keyof typeof csvMoneyColumns]]);
      if (c === 'shopEmail')
        return safeCell(p.shopUserId ? (opts.shopEmails.get(p.shopUserId) ?? '') : '');
      const v = p[c as Exclude<CsvColumn, 'shopEmail' | keyof typeof csvMoneyColumns>];
      return v == null ? '' : safeCell(String(v));
    }),
  );
  return UTF8_BOM + Papa.unparse({ fields: [...columns], data: rows }, { newline: '\r\n' });
}

function lookup<T extends string>(
  ids: readonly T[],
  labels: Record<T, string>,
  raw: string,
): T | undefined {
  const lower = raw.trim().toLowerCase();
  return ids.find((id) => id === lower || labels[id].toLowerCase() === lower);
}

/** A cell that names none of the allowed values: echo it, and list what is allowed. */
function notOneOf(what: string, raw: string, ids: readonly string[]): string {
  const given = raw.trim() ? `"${raw.trim()}" is not a ${what}` : `The ${what} is empty`;
  return `${given}. Use one of: ${ids.join(', ')} (or its name as the ledger shows it).`;
}

export type CsvRowResult = {
  row: number;
  input: Record<string, unknown>;
  fields: Record<string, string>;
};

/**
 * Turns CSV text into part inputs (not yet validated by the part schema). Header
 * problems are returned as a single message; cell problems per row and field.
 */
export function parseCsv(
  text: string,
  shopIdsByEmail: Map<string, string>,
): { ok: false; message: string } | { ok: true; rows: CsvRowResult[] } {
  const parsed = Papa.parse<Record<string, string>>(text.replace(/^\uFEFF/, ''), {
    header: true,
    skipEmptyLines: 'greedy',
    transformHeader: (h) => h.trim(),
  });
  const header = parsed.meta.fields ?? [];
  const unknown = header.filter((h) => !(csvColumns as readonly string[]).includes(h));
  if (unknown.length)
    return {
      ok: false,
      message: `Unknown columns: ${unknown.join(', ')}. Expected: ${csvColumns.join(', ')}`,
    };
  for (const required of ['category', 'name'] as const) {
    if (!header.includes(required))
      return { ok: false, message: `The CSV has no "${required}" column` };
  }
  if (parsed.data.length === 0) return { ok: false, message: 'The CSV has no rows' };
  if (parsed.data.length > 5000) return { ok: false, message: 'At most 5000 rows in one import' };
  const badShape = parsed.errors.find((e) => e.type === 'FieldMismatch' || e.type === 'Quotes');
  if (badShape)
    return { ok: false, message: `Row ${(badShape.row ?? 0) + 2}: ${badShape.message}` };

  const rows = parsed.data.map((cells, i): CsvRowResult => {
    const input: Record<string, unknown> = {};
    const fields: Record<string, string> = {};
    const get = (c: CsvColumn) => unsafeCell(cells[c] ?? '').trim();
    const category = lookup(partCategories, partCategoryLabels, get('category'));
    if (category) input.category = category;
    else fields.category = notOneOf('category', get('category'), partCategories);
    input.name = get('name');
    for (const c of ['vendor', 'partNumber', 'notes', 'ratingFor'] as const)
      if (c in cells) input[c] = get(c);
    if (get('quantity')) input.quantity = Number(get('quantity'));
    if (get('status')) {
      const status = lookup(partStatuses, partStatusLabels, get('status'));
      if (status) input.status = status;
      else fields.status = notOneOf('status', get('status'), partStatuses);
    }
    if (get('turnaroundDays')) input.turnaroundDays = Number(get('turnaroundDays'));
    if (get('ratingValue')) input.ratingValue = Number(get('ratingValue'));
    if (get('ratingUnit')) {
      const unit = lookup(ratingUnits, ratingUnitLabels, get('ratingUnit'));
      if (unit) input.ratingUnit = unit;
      else fields.ratingUnit = notOneOf('rating unit', get('ratingUnit'), ratingUnits);
    }
    for (const c of dateColumns) if (get(c)) input[c] = get(c);
    for (const [c, key] of Object.entries(csvMoneyColumns)) {
      const raw = get(c as CsvColumn);
      if (!raw) continue;
      const cents = parseMoneyToCents(raw);
      if (cents === null || Number.isNaN(cents))
        fields[key] = `"${raw}" is not an amount like 1234.56`;
      else input[key] = cents;
    }
    const shop = get('shopEmail').toLowerCase();
    if (shop) {
      const id = shopIdsByEmail.get(shop);
      if (id) input.shopUserId = id;
      else fields.shopUserId = `${shop} is not a shop member of this build`;
    }
    return { row: i + 2, input, fields }; // row 1 is the header
  });
  return { ok: true, rows };
}
