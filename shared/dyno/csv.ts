/**
 * A run's curve as CSV, pure (no file or network access): the page reads a
 * file and hands the text here, and every problem is reported, row by row,
 * before anything is saved.
 *
 * Header: one column per quantity, named `<quantity>_<unit>`:
 *
 *   rpm                                  required, rev/min
 *   power_hp | power_kw | power_ps       power, torque or both
 *   torque_lbft | torque_nm
 *   boost_psi | boost_bar | boost_kpa    optional, gauge
 *   egt_c | egt_f                        optional
 *   afr | lambda                         optional
 *
 * Names are matched without regard to case or surrounding spaces; columns may
 * come in any order. `power_…` and `torque_…` may end in `_uncorrected`,
 * which is what the exporter writes: the values are as measured either way.
 * Any other ending (`power_hp_corrected`, `power_hp_sae`) is refused, so a
 * corrected figure is never stored as measured and corrected a second time.
 * Lines starting with `#` are comments.
 *
 * Cells: plain decimal numbers (a point for the decimal, an optional
 * exponent); empty means not logged. A row needs rpm above zero and power or
 * torque. Rows out of rpm order are sorted (and `reordered` says so). Files
 * over 2 MB or with more than 20 000 rows are refused whole.
 */
import Papa from 'papaparse';
import {
  MAX_CURVE_CSV_BYTES,
  MAX_CURVE_ROWS,
  curveRowSchema,
  unitValueIssues,
  type BoostUnit,
  type CurveRow,
  type DynoPowerUnit,
  type DynoTemperatureUnit,
  type DynoTorqueUnit,
  type MixtureKind,
  type RunUnits,
} from '@shared/schemas/dyno';
import { isSortedByRpm, sortCurve } from './curve';

type Field = 'rpm' | 'power' | 'torque' | 'boost' | 'egt' | 'mixture';

/** Unit tokens as they appear in column names, for each quantity. */
export const csvUnitTokens = {
  power: { hp: 'hp', kw: 'kw', ps: 'ps' } as Record<string, DynoPowerUnit>,
  torque: { lbft: 'lbf-ft', nm: 'n-m' } as Record<string, DynoTorqueUnit>,
  boost: { psi: 'psi', bar: 'bar', kpa: 'kpa' } as Record<string, BoostUnit>,
  egt: { c: 'c', f: 'f' } as Record<string, DynoTemperatureUnit>,
} as const;

const tokenFor = {
  power: { hp: 'hp', kw: 'kw', ps: 'ps' } satisfies Record<DynoPowerUnit, string>,
  torque: { 'lbf-ft': 'lbft', 'n-m': 'nm' } satisfies Record<DynoTorqueUnit, string>,
  boost: { psi: 'psi', bar: 'bar', kpa: 'kpa' } satisfies Record<BoostUnit, string>,
  egt: { c: 'c', f: 'f' } satisfies Record<DynoTemperatureUnit, string>,
};

/** The suffix the exporter puts on power and torque columns. */
export const UNCORRECTED_SUFFIX = '_uncorrected';

/** The first line the exporter writes. */
export const CSV_COMMENT =
  '# Headroom dyno curve. Power and torque are as measured (uncorrected); Headroom applies a correction only when it shows them.';

const COLUMN_HELP =
  'Columns are rpm, power_hp|power_kw|power_ps, torque_lbft|torque_nm, boost_psi|boost_bar|boost_kpa, egt_c|egt_f, and afr or lambda';

/** The units a file's columns were in; null for a quantity the file does not have. */
export type CurveCsvUnits = {
  powerUnit: DynoPowerUnit | null;
  torqueUnit: DynoTorqueUnit | null;
  boostUnit: BoostUnit | null;
  egtUnit: DynoTemperatureUnit | null;
  mixtureKind: MixtureKind | null;
};

/** A problem: `row` is the data row (1 = the first row under the header), null for the file or header. */
export type CurveCsvError = { row: number | null; column: string | null; message: string };

export type CurveCsvResult =
  | {
      ok: true;
      units: CurveCsvUnits;
      /** Rows sorted by rpm, values in the file's units, null where a cell was empty or the column absent. */
      rows: CurveRow[];
      /** True when the rows were not in rpm order in the file. */
      reordered: boolean;
    }
  | {
      ok: false;
      /** The first {@link MAX_REPORTED_ERRORS} problems. */
      errors: CurveCsvError[];
      /** How many problems there were in all. */
      errorCount: number;
    };

/** At most this many problems are listed (all are counted). */
export const MAX_REPORTED_ERRORS = 100;

type ColumnSpec = { field: Field; name: string };

function readHeader(
  header: string[],
):
  | { ok: true; columns: ColumnSpec[]; units: CurveCsvUnits }
  | { ok: false; errors: CurveCsvError[] } {
  const errors: CurveCsvError[] = [];
  const columns: ColumnSpec[] = [];
  const units: CurveCsvUnits = {
    powerUnit: null,
    torqueUnit: null,
    boostUnit: null,
    egtUnit: null,
    mixtureKind: null,
  };
  const seen = new Map<Field, string>();
  const fail = (column: string | null, message: string) =>
    errors.push({ row: null, column, message });
  header.forEach((raw, i) => {
    const name = raw.trim().toLowerCase();
    if (name === '') {
      fail(null, `Column ${i + 1} has no name. ${COLUMN_HELP}.`);
      return;
    }
    let field: Field;
    if (name === 'rpm') field = 'rpm';
    else if (name === 'afr' || name === 'lambda') {
      field = 'mixture';
      if (!seen.has('mixture')) units.mixtureKind = name;
    } else {
      const m = /^(power|torque|boost|egt)_([a-z0-9]+)(_.*)?$/.exec(name);
      if (!m) {
        fail(raw, `Unknown column "${raw.trim()}". ${COLUMN_HELP}.`);
        return;
      }
      const quantity = m[1] as 'power' | 'torque' | 'boost' | 'egt';
      const token = m[2];
      const suffix = m[3];
      if (suffix !== undefined) {
        if (quantity === 'power' || quantity === 'torque') {
          if (suffix !== UNCORRECTED_SUFFIX) {
            fail(
              raw,
              `Column "${raw.trim()}" looks like a corrected or relabelled figure. Headroom takes ${quantity} as measured (a plain "${quantity}_${token}" or "${quantity}_${token}${UNCORRECTED_SUFFIX}" column) and applies corrections itself.`,
            );
            return;
          }
        } else {
          fail(raw, `Unknown column "${raw.trim()}". ${COLUMN_HELP}.`);
          return;
        }
      }
      const tokens: Record<string, string> = csvUnitTokens[quantity];
      const unit = Object.hasOwn(tokens, token) ? tokens[token] : undefined;
      if (unit === undefined) {
        fail(
          raw,
          `Unknown unit "${token}" in column "${raw.trim()}": ${quantity} is in ${Object.keys(csvUnitTokens[quantity]).join(', ')}.`,
        );
        return;
      }
      field = quantity;
      if (!seen.has(quantity)) {
        if (quantity === 'power') units.powerUnit = unit as DynoPowerUnit;
        if (quantity === 'torque') units.torqueUnit = unit as DynoTorqueUnit;
        if (quantity === 'boost') units.boostUnit = unit as BoostUnit;
        if (quantity === 'egt') units.egtUnit = unit as DynoTemperatureUnit;
      }
    }
    const earlier = seen.get(field);
    if (earlier !== undefined) {
      fail(raw, `Columns "${earlier}" and "${raw.trim()}" hold the same quantity; keep one.`);
      return;
    }
    seen.set(field, raw.trim());
    columns.push({ field, name: raw.trim() });
  });
  if (errors.length === 0) {
    if (!seen.has('rpm')) fail(null, `The header has no rpm column. ${COLUMN_HELP}.`);
    if (!seen.has('power') && !seen.has('torque')) {
      fail(null, `The header has neither a power nor a torque column. ${COLUMN_HELP}.`);
    }
  }
  return errors.length ? { ok: false, errors } : { ok: true, columns, units };
}

const NUMBER = /^[+-]?(\d+(\.\d*)?|\.\d+)([eE][+-]?\d+)?$/;

/** A cell as a number: null when empty, undefined when not a plain decimal number. */
function readNumber(cell: string | undefined): number | null | undefined {
  const text = (cell ?? '').trim();
  if (text === '') return null;
  if (!NUMBER.test(text)) return undefined;
  const n = Number(text);
  return Number.isFinite(n) ? n : undefined;
}

function utf8Bytes(text: string): number {
  return new TextEncoder().encode(text).length;
}

/**
 * Reads a curve from CSV text (see the module note for the format). Either
 * every row is good and the rows come back sorted by rpm, or nothing comes
 * back but the problems: the file's, the header's, or each row's, naming the
 * row and column.
 */
export function parseCurveCsv(text: string): CurveCsvResult {
  const refuse = (message: string): CurveCsvResult => ({
    ok: false,
    errors: [{ row: null, column: null, message }],
    errorCount: 1,
  });
  if (utf8Bytes(text) > MAX_CURVE_CSV_BYTES) {
    return refuse(
      `The file is larger than 2 MB (${MAX_CURVE_CSV_BYTES} bytes); split it or thin the rows.`,
    );
  }
  const parsed = Papa.parse<string[]>(text.replace(/^\uFEFF/, ''), {
    header: false,
    comments: '#',
    skipEmptyLines: 'greedy',
  });
  const [header, ...data] = parsed.data;
  if (!header) return refuse('The file is empty: it needs a header line and at least one row.');
  if (data.length > MAX_CURVE_ROWS) {
    return refuse(`The file has ${data.length} rows; a curve has at most ${MAX_CURVE_ROWS}.`);
  }
  const head = readHeader(header);
  if (!head.ok) return { ok: false, errors: head.errors, errorCount: head.errors.length };
  if (data.length === 0) return refuse('The file has a header but no rows.');

  const errors: CurveCsvError[] = [];
  const rows: CurveRow[] = [];
  const columnOf = new Map<Field, string>(head.columns.map((c) => [c.field, c.name]));
  const unitsForCheck: Partial<RunUnits> = {
    boostUnit: head.units.boostUnit ?? undefined,
    egtUnit: head.units.egtUnit ?? undefined,
    mixtureKind: head.units.mixtureKind ?? undefined,
  };
  data.forEach((cells, i) => {
    const row = i + 1;
    const rowErrors: CurveCsvError[] = [];
    if (cells.length !== head.columns.length) {
      rowErrors.push({
        row,
        column: null,
        message: `Row ${row} has ${cells.length} cells; the header has ${head.columns.length}.`,
      });
    } else {
      const values: Record<Field, number | null> = {
        rpm: null,
        power: null,
        torque: null,
        boost: null,
        egt: null,
        mixture: null,
      };
      head.columns.forEach((col, j) => {
        const n = readNumber(cells[j]);
        if (n === undefined) {
          rowErrors.push({
            row,
            column: col.name,
            message: `Row ${row}, ${col.name}: "${cells[j].trim()}" is not a number.`,
          });
        } else {
          values[col.field] = n;
        }
      });
      if (rowErrors.length === 0) {
        if (values.rpm === null) {
          rowErrors.push({
            row,
            column: columnOf.get('rpm')!,
            message: `Row ${row}: rpm is empty.`,
          });
        } else {
          const checked = curveRowSchema.safeParse(values);
          if (!checked.success) {
            for (const issue of checked.error.issues) {
              const field = issue.path[0] as Field;
              const column =
                columnOf.get(field) ??
                (field === 'power' ? (columnOf.get('power') ?? columnOf.get('torque')) : null) ??
                null;
              rowErrors.push({
                row,
                column,
                message:
                  issue.message === 'Give power, torque or both'
                    ? `Row ${row}: give power, torque or both.`
                    : `Row ${row}, ${column ?? field}: ${issue.message}.`,
              });
            }
          } else {
            for (const [field, message] of Object.entries(
              unitValueIssues(checked.data, unitsForCheck),
            )) {
              const column = columnOf.get(field as Field) ?? field;
              rowErrors.push({ row, column, message: `Row ${row}, ${column}: ${message}.` });
            }
            if (rowErrors.length === 0) rows.push(checked.data);
          }
        }
      }
    }
    errors.push(...rowErrors);
  });
  if (errors.length) {
    return { ok: false, errors: errors.slice(0, MAX_REPORTED_ERRORS), errorCount: errors.length };
  }
  const reordered = !isSortedByRpm(rows);
  return { ok: true, units: head.units, rows: reordered ? sortCurve(rows) : rows, reordered };
}

/**
 * Writes a curve as CSV: a comment line saying the figures are uncorrected,
 * then `rpm,power_<unit>_uncorrected,torque_<unit>_uncorrected` and the boost,
 * EGT and mixture columns any row has a value for. Always the measured
 * values, in the run's units, numbers written in full (shortest round-trip
 * form), so {@link parseCurveCsv} reads back the same rows. Rows are written
 * sorted by rpm.
 */
export function curveToCsv(rows: readonly CurveRow[], units: RunUnits): string {
  const columns: { field: Field; name: string }[] = [
    { field: 'rpm', name: 'rpm' },
    { field: 'power', name: `power_${tokenFor.power[units.powerUnit]}${UNCORRECTED_SUFFIX}` },
    { field: 'torque', name: `torque_${tokenFor.torque[units.torqueUnit]}${UNCORRECTED_SUFFIX}` },
  ];
  if (rows.some((r) => r.boost != null)) {
    columns.push({ field: 'boost', name: `boost_${tokenFor.boost[units.boostUnit]}` });
  }
  if (rows.some((r) => r.egt != null)) {
    columns.push({ field: 'egt', name: `egt_${tokenFor.egt[units.egtUnit]}` });
  }
  if (rows.some((r) => r.mixture != null)) {
    columns.push({ field: 'mixture', name: units.mixtureKind });
  }
  const body = Papa.unparse(
    {
      fields: columns.map((c) => c.name),
      data: sortCurve(rows).map((r) =>
        columns.map((c) => {
          const v = r[c.field];
          return v == null ? '' : String(v);
        }),
      ),
    },
    { newline: '\r\n' },
  );
  return `${CSV_COMMENT}\r\n${body}\r\n`;
}
