import { describe, expect, it } from 'vitest';
import {
  CSV_COMMENT,
  correctRunFor,
  curveToCsv,
  parseCurveCsv,
  type CurveCsvResult,
  type DynoRunData,
  type RunContext,
} from '@shared/dyno';
import {
  MAX_CURVE_ROWS,
  correctionStandards,
  type CurveRow,
  type RunUnits,
} from '@shared/schemas/dyno';

function ok(result: CurveCsvResult) {
  if (!result.ok) throw new Error(`expected the file to be read: ${JSON.stringify(result.errors)}`);
  return result;
}

function failed(result: CurveCsvResult) {
  if (result.ok) throw new Error('expected the file to be refused');
  return result;
}

const row = (rpm: number, values: Partial<Omit<CurveRow, 'rpm'>> = {}): CurveRow => ({
  rpm,
  power: null,
  torque: null,
  boost: null,
  egt: null,
  mixture: null,
  ...values,
});

describe('reading a curve from CSV', () => {
  it('reads a good file with its units', () => {
    const r = ok(
      parseCurveCsv(
        [
          'rpm,power_hp,torque_lbft,boost_psi,egt_c,afr',
          '2000,380.8,1000,30,610,21',
          '2500,470,987.4,35,650,20',
          '3000,480,,38,690,19.5',
        ].join('\n'),
      ),
    );
    expect(r.units).toEqual({
      powerUnit: 'hp',
      torqueUnit: 'lbf-ft',
      boostUnit: 'psi',
      egtUnit: 'c',
      mixtureKind: 'afr',
    });
    expect(r.rows).toEqual([
      row(2000, { power: 380.8, torque: 1000, boost: 30, egt: 610, mixture: 21 }),
      row(2500, { power: 470, torque: 987.4, boost: 35, egt: 650, mixture: 20 }),
      row(3000, { power: 480, boost: 38, egt: 690, mixture: 19.5 }),
    ]);
    expect(r.reordered).toBe(false);
  });

  it('reads every listed unit, any column order, any case, with comments and a BOM', () => {
    const r = ok(
      parseCurveCsv(
        '\uFEFF# from the shop\r\nTorque_Nm, RPM ,power_kw,boost_bar,egt_f,lambda\r\n1356,2000,284,2.1,1200,1.4\r\n',
      ),
    );
    expect(r.units).toEqual({
      powerUnit: 'kw',
      torqueUnit: 'n-m',
      boostUnit: 'bar',
      egtUnit: 'f',
      mixtureKind: 'lambda',
    });
    expect(r.rows).toEqual([
      row(2000, { power: 284, torque: 1356, boost: 2.1, egt: 1200, mixture: 1.4 }),
    ]);
    expect(ok(parseCurveCsv('rpm,power_ps,boost_kpa\n2000,300,150')).units).toMatchObject({
      powerUnit: 'ps',
      boostUnit: 'kpa',
      torqueUnit: null,
    });
  });

  it('refuses an unknown column', () => {
    const r = failed(parseCurveCsv('rpm,power_hp,wheel_speed\n2000,400,55'));
    expect(r.errors).toHaveLength(1);
    expect(r.errors[0]).toMatchObject({ row: null, column: 'wheel_speed' });
    expect(r.errors[0].message).toMatch(/^Unknown column "wheel_speed"/);
  });

  it('refuses an unknown unit, naming the units it takes', () => {
    const r = failed(parseCurveCsv('rpm,power_bhp\n2000,400'));
    expect(r.errors[0].message).toBe(
      'Unknown unit "bhp" in column "power_bhp": power is in hp, kw, ps.',
    );
    expect(failed(parseCurveCsv('rpm,torque_nm,boost_inhg\n2000,400,5')).errors[0].message).toMatch(
      /^Unknown unit "inhg" in column "boost_inhg"/,
    );
    // Not a way in for a prototype key.
    expect(failed(parseCurveCsv('rpm,power_constructor\n2000,400')).errors[0].message).toMatch(
      /^Unknown unit "constructor"/,
    );
  });

  it('refuses corrected figures, so nothing is corrected twice', () => {
    const r = failed(parseCurveCsv('rpm,power_hp_corrected\n2000,400'));
    expect(r.errors[0].message).toMatch(/corrected or relabelled figure/);
    expect(failed(parseCurveCsv('rpm,torque_lbft_sae\n2000,400')).ok).toBe(false);
  });

  it('refuses a header without rpm, without power or torque, or with a quantity twice', () => {
    expect(failed(parseCurveCsv('power_hp\n400')).errors[0].message).toMatch(/no rpm column/);
    expect(failed(parseCurveCsv('rpm,boost_psi\n2000,30')).errors[0].message).toMatch(
      /neither a power nor a torque column/,
    );
    expect(failed(parseCurveCsv('rpm,power_hp,power_kw\n2000,400,298')).errors[0].message).toMatch(
      /hold the same quantity/,
    );
  });

  it('names the row and column of a cell that is not a number, and reports every bad row', () => {
    const r = failed(
      parseCurveCsv(
        [
          'rpm,power_hp,torque_lbft',
          '2000,380,1000',
          '2500,abc,990',
          '3000,0x10,',
          '3500,1e3,',
        ].join('\n'),
      ),
    );
    expect(r.errorCount).toBe(2);
    expect(r.errors).toEqual([
      { row: 2, column: 'power_hp', message: 'Row 2, power_hp: "abc" is not a number.' },
      { row: 3, column: 'power_hp', message: 'Row 3, power_hp: "0x10" is not a number.' },
    ]);
  });

  it('checks each row like the schema: rpm above zero, no negative power, one of power or torque', () => {
    const r = failed(
      parseCurveCsv(
        [
          'rpm,power_hp,torque_lbft,boost_psi',
          '0,380,1000,30',
          '2500,-5,990,30',
          '3000,,,30',
          ',400,,',
          '3500,400,,400',
        ].join('\n'),
      ),
    );
    expect(r.errors.map((e) => e.message)).toEqual([
      'Row 1, rpm: rpm must be above zero.',
      'Row 2, power_hp: Power cannot be negative.',
      'Row 3: give power, torque or both.',
      'Row 4: rpm is empty.',
      'Row 5, boost_psi: Boost must be between −14.5 and 290.07 psi (−100 to 2000 kPa).',
    ]);
  });

  it('refuses a row with the wrong number of cells', () => {
    const r = failed(parseCurveCsv('rpm,power_hp\n2000,400\n2500,420,7'));
    expect(r.errors).toEqual([
      { row: 2, column: null, message: 'Row 2 has 3 cells; the header has 2.' },
    ]);
  });

  it('sorts rows that are out of rpm order, and says so', () => {
    const r = ok(parseCurveCsv('rpm,power_hp\n3000,480\n2000,380\n2500,470\n2500,471'));
    expect(r.rows.map((x) => [x.rpm, x.power])).toEqual([
      [2000, 380],
      [2500, 470],
      [2500, 471],
      [3000, 480],
    ]);
    expect(r.reordered).toBe(true);
  });

  it('refuses more than 20,000 rows, and more than 2 MB', () => {
    const lines = (n: number) =>
      ['rpm,power_hp', ...Array.from({ length: n }, (_, i) => `${1000 + i / 4},400`)].join('\n');
    expect(ok(parseCurveCsv(lines(MAX_CURVE_ROWS))).rows).toHaveLength(MAX_CURVE_ROWS);
    const tooMany = failed(parseCurveCsv(lines(MAX_CURVE_ROWS + 1)));
    expect(tooMany.errors[0].message).toBe('The file has 20001 rows; a curve has at most 20000.');
    const big = `rpm,power_hp\n2000,400\n${'#'.repeat(2 * 1024 * 1024)}`;
    expect(failed(parseCurveCsv(big)).errors[0].message).toMatch(/larger than 2 MB/);
  });

  it('refuses an empty file and a header with no rows', () => {
    expect(failed(parseCurveCsv('')).errors[0].message).toMatch(/empty/);
    expect(failed(parseCurveCsv('rpm,power_hp\n')).errors[0].message).toMatch(/no rows/);
  });
});

describe('writing a curve as CSV', () => {
  const units: RunUnits = {
    powerUnit: 'kw',
    torqueUnit: 'n-m',
    boostUnit: 'bar',
    egtUnit: 'c',
    mixtureKind: 'lambda',
  };
  // Values that need all 17 significant digits (0.1 + 0.2, 903.7 / 3) must come back bit for bit.
  const rows: CurveRow[] = [
    row(1800.5, { torque: 1234.5678901234567, boost: 1.05, egt: 540.25, mixture: 1.62 }),
    row(2400, { power: 0.1 + 0.2, torque: 1180, boost: 2.2, mixture: 1.4 }),
    row(3100, { power: 903.7 / 3, egt: 710 }),
  ];

  it('says the values are uncorrected, in a comment and in the column names', () => {
    const text = curveToCsv(rows, units);
    const [comment, header] = text.split('\r\n');
    expect(comment).toBe(CSV_COMMENT);
    expect(comment).toMatch(/uncorrected/);
    expect(header).toBe('rpm,power_kw_uncorrected,torque_nm_uncorrected,boost_bar,egt_c,lambda');
    // Optional columns only when some row has a value.
    expect(curveToCsv([row(2000, { power: 400 })], units).split('\r\n')[1]).toBe(
      'rpm,power_kw_uncorrected,torque_nm_uncorrected',
    );
  });

  it('round trip: export → import gives the same rows and units', () => {
    const back = ok(parseCurveCsv(curveToCsv(rows, units)));
    expect(back.rows).toEqual(rows);
    expect(back.units).toEqual(units);
    expect(back.reordered).toBe(false);
  });

  it('round trip sorts a curve stored out of order, and loses nothing', () => {
    const shuffled = [rows[2], rows[0], rows[1]];
    expect(ok(parseCurveCsv(curveToCsv(shuffled, units))).rows).toEqual(rows);
  });

  it('a run corrected under each standard gives the same corrected figures after a CSV round trip', () => {
    // Factors differ from 1 (reference.md checks at 30 °C, 97 kPa), so a second correction would show.
    const run: DynoRunData = {
      powerUnit: 'hp',
      torqueUnit: 'lbf-ft',
      boostUnit: 'psi',
      boost: 38,
      curve: [
        row(2000, { torque: 1000, boost: 30 }),
        row(2500, { power: 470, torque: 987.4, boost: 35 }),
        row(3000, { power: 480, boost: 38 }),
      ],
    };
    const runUnits: RunUnits = { ...run, egtUnit: 'c', mixtureKind: 'afr' };
    const context: RunContext = {
      dynoKind: 'chassis',
      sessionWeather: {
        temperature: 30,
        temperatureUnit: 'c',
        pressure: 97,
        pressureUnit: 'kpa',
        relativeHumidityPct: 40,
      },
      engine: {
        aspiration: 'turbocharged',
        displacementL: 6.7,
        bsfc: 0.4,
        bsfcUnit: 'lb-per-hp-h',
        drivetrainLossPct: 18,
      },
    };
    for (const standard of correctionStandards) {
      const before = correctRunFor(run, { standard }, context);
      const imported = ok(parseCurveCsv(curveToCsv(run.curve!, runUnits)));
      const after = correctRunFor({ ...run, curve: imported.rows }, { standard }, context);
      expect(after.curve, standard).toEqual(before.curve);
      expect(after.corrected, standard).toEqual(before.corrected);
      expect(after.correction.factor, standard).toBe(before.correction.factor);
      if (standard !== 'uncorrected') expect(before.correction.factor, standard).not.toBe(1);
      // Corrected once: the 2500 rpm row is factor × the measured 470 hp.
      expect(after.curve[1].power, standard).toBe(before.correction.factor * 470);
    }
  });
});
