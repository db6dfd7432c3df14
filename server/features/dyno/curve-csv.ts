/**
 * A curve CSV as the API receives it: bytes that must be UTF-8, then the
 * shared parser (shared/dyno/csv.ts), whose problems become a 400 naming the
 * file's header, or each bad row and column — nothing is saved.
 */
import { parseCurveCsv, type CurveCsvError } from '@shared/dyno';
import { AppError } from '@server/lib/errors';

export type RowReport = { row: number; fields: Record<string, string> };

/** The file as text; 400 when its bytes are not UTF-8 (a spreadsheet's "CSV" in another code page). */
export function decodeUtf8(buffer: Buffer, field = 'file'): string {
  try {
    return new TextDecoder('utf-8', { fatal: true }).decode(buffer);
  } catch {
    throw new AppError(
      400,
      'not_utf8',
      'The file is not UTF-8 text. Save the CSV as UTF-8 and try again; nothing was saved.',
      { [field]: 'Not UTF-8 text: save the CSV as UTF-8' },
    );
  }
}

function byRow(errors: CurveCsvError[]): RowReport[] {
  const rows = new Map<number, Record<string, string>>();
  for (const e of errors) {
    if (e.row === null) continue;
    const fields = rows.get(e.row) ?? {};
    fields[e.column ?? '_'] ??= e.message;
    rows.set(e.row, fields);
  }
  return [...rows].map(([row, fields]) => ({ row, fields }));
}

/** Reads a curve from an uploaded CSV, or throws the 400 that names every problem. */
export function readCurveCsv(buffer: Buffer, field = 'file') {
  const result = parseCurveCsv(decodeUtf8(buffer, field));
  if (result.ok) return result;
  const fileErrors = result.errors.filter((e) => e.row === null);
  if (fileErrors.length) {
    // The file or its header: one message for the file, one per named column.
    const fields: Record<string, string> = { [field]: fileErrors[0].message };
    for (const e of fileErrors) if (e.column) fields[`${field}.${e.column}`] ??= e.message;
    throw new AppError(
      400,
      'bad_csv',
      `${fileErrors.map((e) => e.message).join(' ')} Nothing was saved.`,
      fields,
    );
  }
  const rows = byRow(result.errors);
  const more =
    result.errorCount > result.errors.length
      ? ` (the first ${result.errors.length} of ${result.errorCount} problems are listed)`
      : '';
  const err = new AppError(
    400,
    'invalid_rows',
    `${rows.length === 1 ? '1 row needs' : `${rows.length} rows need`} fixing${more}; nothing was saved`,
    { [field]: `Row ${rows[0].row}: ${Object.values(rows[0].fields)[0]}` },
  );
  throw Object.assign(err, { rows });
}
