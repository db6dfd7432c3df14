/**
 * A sheet's values as CSV, and the two ways values come in from outside: a
 * CSV file and a block pasted from a spreadsheet. Both parsers are pure and
 * check every cell before anything is saved, answering one error per cell
 * (row, column, message) so the page can mark each one.
 *
 * The CSV has one row per injector position and one column per test point:
 *
 *   Position,Full load,Idle,Return flow
 *   1,52.0,6.1,12.3
 *   2,53.5,,11.9        ← an empty cell is a missing value (null), never a zero
 *
 * Numbers take a decimal point. A cell with a single comma between digits and
 * no point is read as a decimal comma ("52,1" is 52.1) unless exactly three
 * digits follow the comma ("1,600" could be 1600 or 1.6), which is refused as
 * ambiguous. Thousands separators are not accepted.
 */
import Papa from 'papaparse';
import { normalizeLabel, type BenchCellError } from '@shared/schemas/bench';
import { BENCH_MAX_CYLINDERS, BENCH_MAX_VALUE } from './limits';

export type { BenchCellError };

/** Headings the position column may carry (case ignored). */
export const positionHeadings = ['position', 'injector', 'cylinder', 'pos', 'pos.', '#'] as const;

/** Rows a CSV may hold; more is not a bench sheet. */
export const BENCH_CSV_MAX_ROWS = 200;

/** A cell read as a bench value: a number of zero or more, null when empty, or why it is refused. */
export type CellReading = { ok: true; value: number | null } | { ok: false; message: string };

/**
 * Reads one cell. Empty (or only spaces) is null. Accepts "52.1", "52", ".5",
 * "52,1" (decimal comma); refuses "1,600" (ambiguous), "1,600.5" (thousands
 * separator), letters, negatives and values over the bench maximum.
 */
export function readBenchCell(raw: string): CellReading {
  const text = raw.replace(/[\s\u00a0\u202f]+/g, ' ').trim();
  if (text === '') return { ok: true, value: null };
  let normal = text;
  if (/^[+-]?\d+,\d+$/.test(text)) {
    const after = text.split(',')[1]!;
    if (after.length === 3) {
      return {
        ok: false,
        message: `"${text}" could be ${text.replace(',', '')} or ${text.replace(',', '.')}: write it without the comma, or with a decimal point`,
      };
    }
    normal = text.replace(',', '.');
  } else if (/^[+-]?\d{1,3}(,\d{3})+(\.\d*)?$/.test(text)) {
    return { ok: false, message: `"${text}": write numbers without a thousands separator` };
  }
  if (!/^[+-]?(\d+\.?\d*|\.\d+)$/.test(normal)) {
    return {
      ok: false,
      message: `"${text}" is not a number (leave the cell empty when there is no value)`,
    };
  }
  const value = Number(normal);
  if (value < 0) return { ok: false, message: 'A bench value cannot be negative' };
  if (value > BENCH_MAX_VALUE) return { ok: false, message: 'That value is too large' };
  return { ok: true, value: value === 0 ? 0 : value };
}

/** Stops a spreadsheet from running a label as a formula (CSV injection). */
function safeCell(value: string) {
  return /^[=+\-@\t\r]/.test(value) ? `'${value}` : value;
}

function unsafeCell(value: string) {
  return value.replace(/^'(?=[=+\-@\t\r])/, '');
}

/**
 * A sheet's values as CSV text: a "Position" heading then each point's label;
 * one row per position 1…cylinders; missing values as empty cells.
 */
export function benchValuesToCsv(
  points: readonly { label: string; values: readonly (number | null)[] }[],
  cylinders: number,
): string {
  const rows = Array.from({ length: cylinders }, (_, i) => [
    String(i + 1),
    ...points.map((p) => {
      const v = p.values[i];
      return v == null ? '' : String(v);
    }),
  ]);
  return Papa.unparse(
    { fields: ['Position', ...points.map((p) => safeCell(p.label))], data: rows },
    { newline: '\r\n' },
  );
}

export type BenchCsvResult = {
  /** True when there is no error: the values may be saved. */
  ok: boolean;
  /** values[i][p − 1]: the value of options.points[i] at position p; null where empty or absent. */
  values: (number | null)[][];
  /** Positions that had a row in the file, ascending. */
  positions: number[];
  errors: BenchCellError[];
};

/**
 * Parses a sheet's CSV against the sheet's points (matched to the headings by
 * label, case and spacing ignored) and the build's cylinder count. Names every
 * bad cell: not a number, negative, a position beyond the cylinders or given
 * twice, a column that is no point of the sheet or a point with no column, an
 * empty file. Rows count from 1 at the heading row; blank lines count too.
 */
export function parseBenchCsv(
  text: string,
  options: { points: readonly { label: string }[]; cylinders: number },
): BenchCsvResult {
  const { points, cylinders } = options;
  if (!Number.isInteger(cylinders) || cylinders < 1 || cylinders > BENCH_MAX_CYLINDERS) {
    throw new RangeError(
      `cylinders must be a whole number from 1 to ${BENCH_MAX_CYLINDERS} (got ${cylinders})`,
    );
  }
  const values = points.map(() => Array<number | null>(cylinders).fill(null));
  const errors: BenchCellError[] = [];
  const fail = () => ({ ok: false, values, positions: [], errors });
  const fileError = (message: string) =>
    errors.push({ row: null, column: null, columnName: null, message });

  const parsed = Papa.parse<string[]>(text.replace(/^\uFEFF/, ''), { skipEmptyLines: false });
  const isBlank = (cells: string[]) => cells.every((c) => c.trim() === '');
  const records = parsed.data.map((cells, i) => ({ row: i + 1, cells }));
  const headerRecord = records.find((r) => !isBlank(r.cells));
  if (!headerRecord) {
    fileError('The file is empty');
    return fail();
  }
  for (const e of parsed.errors) {
    if (e.type === 'Quotes') {
      errors.push({
        row: e.row === undefined ? null : e.row + 1,
        column: null,
        columnName: null,
        message: 'A quotation mark is not closed on this row',
      });
    }
  }
  const dataRecords = records.filter((r) => r.row > headerRecord.row && !isBlank(r.cells));
  if (dataRecords.length > BENCH_CSV_MAX_ROWS) {
    fileError(`At most ${BENCH_CSV_MAX_ROWS} rows in one file`);
    return fail();
  }

  // ---- the heading row
  const headings = headerRecord.cells.map((h) => unsafeCell(h.trim()));
  const hRow = headerRecord.row;
  const columnOfPoint = new Map<number, number>(); // point index → column index
  const pointOfColumn = new Map<number, number>(); // column index → point index
  const byLabel = new Map(points.map((p, i) => [normalizeLabel(p.label), i] as const));
  const first = headings[0] ?? '';
  if (!(positionHeadings as readonly string[]).includes(first.toLowerCase()) && first !== '') {
    errors.push({
      row: hRow,
      column: 1,
      columnName: first,
      message: 'The first column holds the injector positions: head it "Position"',
    });
  }
  const columnIsEmpty = (c: number) => dataRecords.every((r) => (r.cells[c] ?? '').trim() === '');
  headings.forEach((h, c) => {
    if (c === 0) return;
    if (h === '') {
      if (!columnIsEmpty(c))
        errors.push({
          row: hRow,
          column: c + 1,
          columnName: '',
          message: 'This column has no heading',
        });
      return;
    }
    const p = byLabel.get(normalizeLabel(h));
    if (p === undefined) {
      errors.push({
        row: hRow,
        column: c + 1,
        columnName: h,
        message: `"${h}" is not a test point of this sheet (points: ${points.map((q) => q.label).join(', ')})`,
      });
    } else if (columnOfPoint.has(p)) {
      errors.push({
        row: hRow,
        column: c + 1,
        columnName: h,
        message: `"${h}" is already column ${columnOfPoint.get(p)! + 1}`,
      });
    } else {
      columnOfPoint.set(p, c);
      pointOfColumn.set(c, p);
    }
  });
  points.forEach((p, i) => {
    if (!columnOfPoint.has(i))
      errors.push({
        row: hRow,
        column: null,
        columnName: p.label,
        message: `No column for "${p.label}"`,
      });
  });
  if (dataRecords.length === 0) {
    fileError('The file has headings but no rows of values');
    return fail();
  }

  // ---- the rows of values
  const rowOfPosition = new Map<number, number>();
  for (const { row, cells } of dataRecords) {
    const rawPosition = (cells[0] ?? '').trim();
    let position: number | null = null;
    const positionError = (message: string) =>
      errors.push({ row, column: 1, columnName: headings[0] ?? '', message });
    if (rawPosition === '') positionError('Enter the injector position');
    else if (!/^\d+$/.test(rawPosition) || Number(rawPosition) < 1)
      positionError(`"${rawPosition}" is not an injector position (a whole number from 1)`);
    else if (Number(rawPosition) > cylinders)
      positionError(
        `Position ${Number(rawPosition)} is beyond the build's ${cylinders} cylinder${cylinders === 1 ? '' : 's'}`,
      );
    else if (rowOfPosition.has(Number(rawPosition)))
      positionError(
        `Position ${Number(rawPosition)} is already on row ${rowOfPosition.get(Number(rawPosition))}`,
      );
    else {
      position = Number(rawPosition);
      rowOfPosition.set(position, row);
    }
    cells.forEach((raw, c) => {
      if (c === 0) return;
      if (c >= headings.length) {
        if (raw.trim() !== '')
          errors.push({
            row,
            column: c + 1,
            columnName: null,
            message: 'This cell is past the last heading',
          });
        return;
      }
      const reading = readBenchCell(raw);
      if (!reading.ok) {
        errors.push({ row, column: c + 1, columnName: headings[c]!, message: reading.message });
        return;
      }
      const p = pointOfColumn.get(c);
      if (p !== undefined && position !== null) values[p]![position - 1] = reading.value;
    });
  }
  const positions = [...rowOfPosition.keys()].sort((a, b) => a - b);
  return { ok: errors.length === 0, values, positions, errors };
}

export type PastedGridResult = {
  ok: boolean;
  /** grid[r][c], rows and columns as pasted (short rows padded with null). */
  grid: (number | null)[][];
  errors: BenchCellError[];
};

/**
 * Reads a block pasted from a spreadsheet: rows on new lines, cells split by
 * tabs (or, when the block has no tab at all, by spaces). Empty cells are
 * null; blank lines inside the block are rows of nulls; blank lines at the end
 * are dropped. Every bad cell is named by row and column, from 1.
 */
export function parsePastedGrid(text: string): PastedGridResult {
  const lines = text.replace(/^\uFEFF/, '').split(/\r\n|\n|\r/);
  while (lines.length && lines[lines.length - 1]!.trim() === '') lines.pop();
  while (lines.length && lines[0]!.trim() === '') lines.shift();
  const errors: BenchCellError[] = [];
  if (lines.length === 0) {
    errors.push({ row: null, column: null, columnName: null, message: 'Nothing was pasted' });
    return { ok: false, grid: [], errors };
  }
  const tabbed = lines.some((l) => l.includes('\t'));
  const rows = lines.map((l) =>
    tabbed ? l.split('\t') : l.trim() === '' ? [] : l.trim().split(/[ \u00a0]+/),
  );
  const width = Math.max(1, ...rows.map((r) => r.length));
  const grid = rows.map((cells, r) =>
    Array.from({ length: width }, (_, c) => {
      const reading = readBenchCell(cells[c] ?? '');
      if (reading.ok) return reading.value;
      errors.push({ row: r + 1, column: c + 1, columnName: null, message: reading.message });
      return null;
    }),
  );
  return { ok: errors.length === 0, grid, errors };
}
