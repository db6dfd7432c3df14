import { describe, expect, it } from 'vitest';
import { benchValuesToCsv, parseBenchCsv, parsePastedGrid, readBenchCell } from '@shared/bench';

const points = [{ label: 'Full load' }, { label: 'Idle' }, { label: 'Return flow' }];

/** The error at a row and column (from 1), or undefined. */
function errorAt(
  errors: { row: number | null; column: number | null; message: string }[],
  row: number | null,
  column: number | null,
) {
  return errors.find((e) => e.row === row && e.column === column);
}

describe('reading a cell', () => {
  it('takes a decimal point, and a single comma between digits as a decimal comma', () => {
    expect(readBenchCell('52.1')).toEqual({ ok: true, value: 52.1 });
    expect(readBenchCell(' 52,1 ')).toEqual({ ok: true, value: 52.1 });
    expect(readBenchCell('0,75')).toEqual({ ok: true, value: 0.75 });
    expect(readBenchCell('.5')).toEqual({ ok: true, value: 0.5 });
    expect(readBenchCell('')).toEqual({ ok: true, value: null });
  });

  it('refuses a comma it cannot read one way only, thousands separators and words', () => {
    const ambiguous = readBenchCell('1,600');
    expect(ambiguous.ok).toBe(false);
    if (!ambiguous.ok) expect(ambiguous.message).toContain('could be 1600 or 1.600');
    expect(readBenchCell('1,600.5').ok).toBe(false);
    expect(readBenchCell('52.1.3').ok).toBe(false);
    expect(readBenchCell('n/a').ok).toBe(false);
    expect(readBenchCell('-0.5')).toEqual({
      ok: false,
      message: 'A bench value cannot be negative',
    });
  });
});

describe('bench CSV', () => {
  it('reads a good file, keeping empty cells and absent positions as missing', () => {
    const text = [
      'Position,Full load,Idle,Return flow',
      '1,52.0,6.1,10.2',
      '2,53.5,,9.9',
      '',
      '4,51.2,6.0,10.1',
      '',
    ].join('\r\n');
    const r = parseBenchCsv(text, { points, cylinders: 4 });
    expect(r.errors).toEqual([]);
    expect(r.ok).toBe(true);
    expect(r.positions).toEqual([1, 2, 4]);
    expect(r.values).toEqual([
      [52.0, 53.5, null, 51.2],
      [6.1, null, null, 6.0],
      [10.2, 9.9, null, 10.1],
    ]);
  });

  it('matches headings to points in any order, case and spacing ignored, with a byte-order mark', () => {
    const text = '\uFEFFinjector;return  FLOW;full load;Idle\n1;10,2;52,1;6\n';
    const r = parseBenchCsv(text, { points, cylinders: 1 });
    expect(r.ok).toBe(true);
    expect(r.values).toEqual([[52.1], [6], [10.2]]);
  });

  it('names each bad cell by row and column', () => {
    const text = [
      'Position,Full load,Idle,Return flow',
      '1,52.0,abc,10.2', // row 2: not a number in column 3
      '2,-1,6.0,9.9', // row 3: negative flow in column 2
      '9,52.0,6.0,9.9', // row 4: position beyond 8 cylinders
      '2,52.0,6.0,9.9', // row 5: position 2 again
      '3,52.0,6.0,9.9,7', // row 6: a cell past the last heading
      ',52.0,6.0,9.9', // row 7: no position
      'x,52.0,6.0,9.9', // row 8: not a position
    ].join('\n');
    const r = parseBenchCsv(text, { points, cylinders: 8 });
    expect(r.ok).toBe(false);
    expect(errorAt(r.errors, 2, 3)).toMatchObject({ columnName: 'Idle' });
    expect(errorAt(r.errors, 2, 3)!.message).toContain('"abc" is not a number');
    expect(errorAt(r.errors, 3, 2)).toMatchObject({
      columnName: 'Full load',
      message: 'A bench value cannot be negative',
    });
    expect(errorAt(r.errors, 4, 1)!.message).toBe("Position 9 is beyond the build's 8 cylinders");
    expect(errorAt(r.errors, 5, 1)!.message).toBe('Position 2 is already on row 3');
    expect(errorAt(r.errors, 6, 5)!.message).toBe('This cell is past the last heading');
    expect(errorAt(r.errors, 7, 1)!.message).toBe('Enter the injector position');
    expect(errorAt(r.errors, 8, 1)!.message).toContain('"x" is not an injector position');
    expect(r.errors).toHaveLength(7);
  });

  it('names unknown, repeated and missing columns', () => {
    const text = 'Position,Full load,Pilot,Full load\n1,52,1,52\n';
    const r = parseBenchCsv(text, { points, cylinders: 8 });
    expect(errorAt(r.errors, 1, 3)!.message).toContain('"Pilot" is not a test point of this sheet');
    expect(errorAt(r.errors, 1, 4)!.message).toBe('"Full load" is already column 2');
    const missing = r.errors.filter((e) => e.row === 1 && e.column === null);
    expect(missing.map((e) => e.message)).toEqual([
      'No column for "Idle"',
      'No column for "Return flow"',
    ]);
  });

  it('asks for the position column first', () => {
    const r = parseBenchCsv('Full load,Idle,Return flow\n52,6,10\n', { points, cylinders: 8 });
    expect(errorAt(r.errors, 1, 1)!.message).toContain('head it "Position"');
  });

  it('refuses an empty file and a file with headings only', () => {
    const empty = parseBenchCsv(' \n\n', { points, cylinders: 8 });
    expect(empty.ok).toBe(false);
    expect(empty.errors).toEqual([
      { row: null, column: null, columnName: null, message: 'The file is empty' },
    ]);
    const headingsOnly = parseBenchCsv('Position,Full load,Idle,Return flow\n', {
      points,
      cylinders: 8,
    });
    expect(headingsOnly.errors.map((e) => e.message)).toEqual([
      'The file has headings but no rows of values',
    ]);
  });

  it('writes a sheet that reads back the same, labels guarded against formulas', () => {
    const sheet = [
      { label: 'Full load', values: [52.0, 53.5, null, 51.25] },
      { label: '=Idle', values: [6.1, 6.0, 5.9, 6.2] },
    ];
    const text = benchValuesToCsv(sheet, 4);
    expect(text.split('\r\n')[0]).toBe("Position,Full load,'=Idle");
    expect(text.split('\r\n')[3]).toBe('3,,5.9');
    const r = parseBenchCsv(text, { points: sheet, cylinders: 4 });
    expect(r.ok).toBe(true);
    expect(r.values).toEqual(sheet.map((p) => p.values));
  });
});

describe('pasted block of numbers', () => {
  it('reads tab-separated rows from a spreadsheet, empty cells as null', () => {
    const r = parsePastedGrid('52.1\t6.0\n53,5\t\n\n51.9\t6.2\n\n');
    expect(r.ok).toBe(true);
    expect(r.grid).toEqual([
      [52.1, 6.0],
      [53.5, null],
      [null, null],
      [51.9, 6.2],
    ]);
  });

  it('reads a block without tabs split by spaces', () => {
    expect(parsePastedGrid('52.1 53.5  51.9\r\n6 6.1 5.9').grid).toEqual([
      [52.1, 53.5, 51.9],
      [6, 6.1, 5.9],
    ]);
  });

  it('names each bad cell by row and column', () => {
    const r = parsePastedGrid('52.1\tabc\n-3\t1,600');
    expect(r.ok).toBe(false);
    expect(r.errors.map((e) => [e.row, e.column])).toEqual([
      [1, 2],
      [2, 1],
      [2, 2],
    ]);
    expect(r.grid).toEqual([
      [52.1, null],
      [null, null],
    ]);
  });

  it('says when nothing was pasted', () => {
    expect(parsePastedGrid('\n \n').errors[0]!.message).toBe('Nothing was pasted');
  });
});
