import { nulMessage } from '@shared/schemas/common';
import { describe, expect, it } from 'vitest';
import {
  MAX_CURVE_ROWS,
  correctionChoiceSchema,
  createDynoRunInputSchema,
  createDynoSessionInputSchema,
  curveRowSchema,
  dynoRunIssues,
  updateDynoRunInputSchema,
  updateDynoSessionInputSchema,
  weatherSchema,
  type CreateDynoRunInput,
  type Weather,
} from '@shared/schemas/dyno';

/** The issues of a failed parse as "path: message". */
function issuesOf(result: {
  success: boolean;
  error?: { issues: { path: PropertyKey[]; message: string }[] };
}) {
  expect(result.success, 'expected the parse to fail').toBe(false);
  return result.error!.issues.map((i) => `${i.path.join('.')}: ${i.message}`);
}

const weather: Weather = {
  temperature: 25,
  temperatureUnit: 'c',
  pressure: 99,
  pressureUnit: 'kpa',
};

const run: CreateDynoRunInput = {
  status: 'complete',
  powerUnit: 'hp',
  torqueUnit: 'lbf-ft',
  boostUnit: 'psi',
  egtUnit: 'c',
  mixtureKind: 'afr',
  peakPower: 512.4,
  peakPowerRpm: 3100,
  peakTorque: 1102,
  peakTorqueRpm: 2200,
};

describe('weather', () => {
  it('accepts a plain record and each unit', () => {
    expect(weatherSchema.safeParse(weather).success).toBe(true);
    for (const pressureUnit of ['kpa', 'mbar', 'inhg', 'psi'] as const) {
      // 99 kPa in each unit: 990 mbar, 99/3.386389 inHg, 99/6.894757 psi (NIST SP 811 (2008) B.8/B.9).
      const pressure = { kpa: 99, mbar: 990, inhg: 99 / 3.386389, psi: 99 / 6.894757 }[
        pressureUnit
      ];
      expect(weatherSchema.safeParse({ ...weather, pressure, pressureUnit }).success).toBe(true);
    }
  });

  it('refuses temperatures below −60 °C or above 60 °C, in the unit given', () => {
    // −60 °C = −76 °F and 60 °C = 140 °F ((t − 32)/1.8, NIST SP 811 (2008) B.8): edges are in.
    const ok = (temperature: number, temperatureUnit: 'c' | 'f') =>
      weatherSchema.safeParse({ ...weather, temperature, temperatureUnit }).success;
    expect(ok(-60, 'c')).toBe(true);
    expect(ok(60, 'c')).toBe(true);
    expect(ok(-76, 'f')).toBe(true);
    expect(ok(140, 'f')).toBe(true);
    expect(ok(-60.1, 'c')).toBe(false);
    expect(ok(60.1, 'c')).toBe(false);
    expect(ok(-77, 'f')).toBe(false);
    expect(ok(141, 'f')).toBe(false);
    expect(
      issuesOf(weatherSchema.safeParse({ ...weather, temperature: 141, temperatureUnit: 'f' })),
    ).toEqual(['temperature: Temperature must be between −76 °F and 140 °F (−60 to 60 °C)']);
  });

  it('refuses pressures outside 50–110 kPa after conversion', () => {
    const ok = (pressure: number, pressureUnit: Weather['pressureUnit']) =>
      weatherSchema.safeParse({ ...weather, pressure, pressureUnit }).success;
    expect(ok(50, 'kpa')).toBe(true);
    expect(ok(110, 'kpa')).toBe(true);
    expect(ok(49.9, 'kpa')).toBe(false);
    expect(ok(110.1, 'kpa')).toBe(false);
    // mbar = 0.1 kPa (NIST SP 811 (2008) B.8: 1 mbar = 100 Pa).
    expect(ok(500, 'mbar')).toBe(true);
    expect(ok(1100, 'mbar')).toBe(true);
    expect(ok(499, 'mbar')).toBe(false);
    expect(ok(1101, 'mbar')).toBe(false);
    // inHg = 3.386389 kPa (NIST SP 811 B.8): 32.48 inHg = 109.99 kPa, 32.49 inHg = 110.02 kPa.
    expect(ok(32.48, 'inhg')).toBe(true);
    expect(ok(32.49, 'inhg')).toBe(false);
    // psi = 6.894757 kPa (NIST SP 811 B.9): 7.26 psi = 50.06 kPa, 7.25 psi = 49.99 kPa.
    expect(ok(7.26, 'psi')).toBe(true);
    expect(ok(7.25, 'psi')).toBe(false);
    expect(
      issuesOf(weatherSchema.safeParse({ ...weather, pressure: 14, pressureUnit: 'inhg' })),
    ).toEqual([
      'pressure: Barometric pressure must be between 14.77 and 32.48 inHg (50 to 110 kPa)',
    ]);
  });

  it('refuses humidity outside 0–100 %, a dew point above the temperature, and both at once', () => {
    expect(weatherSchema.safeParse({ ...weather, relativeHumidityPct: 0 }).success).toBe(true);
    expect(weatherSchema.safeParse({ ...weather, relativeHumidityPct: 100 }).success).toBe(true);
    expect(issuesOf(weatherSchema.safeParse({ ...weather, relativeHumidityPct: -1 }))).toEqual([
      'relativeHumidityPct: Relative humidity must be between 0 and 100 %',
    ]);
    expect(
      issuesOf(weatherSchema.safeParse({ ...weather, relativeHumidityPct: 101 })),
    ).toHaveLength(1);
    expect(weatherSchema.safeParse({ ...weather, dewPoint: 25 }).success).toBe(true);
    expect(issuesOf(weatherSchema.safeParse({ ...weather, dewPoint: 25.5 }))).toEqual([
      'dewPoint: The dew point cannot be above the air temperature',
    ]);
    expect(
      issuesOf(weatherSchema.safeParse({ ...weather, relativeHumidityPct: 40, dewPoint: 10 })),
    ).toEqual(['dewPoint: Give the relative humidity or the dew point, not both']);
  });

  it('refuses non-finite numbers, naming the field', () => {
    expect(issuesOf(weatherSchema.safeParse({ ...weather, temperature: Number.NaN }))).toEqual([
      'temperature: Temperature must be a number',
    ]);
    expect(issuesOf(weatherSchema.safeParse({ ...weather, pressure: Infinity }))).toEqual([
      'pressure: Barometric pressure must be a number',
    ]);
  });
});

describe('sessions', () => {
  const session = { date: '2027-06-12', dynoKind: 'chassis' as const, place: 'County line dyno' };

  it('accepts a session with or without weather', () => {
    expect(createDynoSessionInputSchema.safeParse(session).success).toBe(true);
    expect(createDynoSessionInputSchema.safeParse({ ...session, weather }).success).toBe(true);
  });

  it('keeps dates between 1900-01-01 and 2100-12-31', () => {
    const ok = (date: string) =>
      createDynoSessionInputSchema.safeParse({ ...session, date }).success;
    expect(ok('1900-01-01')).toBe(true);
    expect(ok('2100-12-31')).toBe(true);
    expect(ok('1899-12-31')).toBe(false);
    expect(ok('2101-01-01')).toBe(false);
    expect(ok('2027-02-30')).toBe(false);
    expect(ok('12/06/2027')).toBe(false);
  });

  it('refuses text with a NUL character and over-long text', () => {
    expect(
      issuesOf(createDynoSessionInputSchema.safeParse({ ...session, notes: 'pull 3\u0000' })),
    ).toEqual([`notes: ${nulMessage}`]);
    expect(
      issuesOf(createDynoSessionInputSchema.safeParse({ ...session, place: 'x'.repeat(201) })),
    ).toEqual(['place: Place must be at most 200 characters']);
  });

  it('checks the weather inside the session and refuses unknown keys', () => {
    expect(
      issuesOf(
        createDynoSessionInputSchema.safeParse({
          ...session,
          weather: { ...weather, pressure: 200 },
        }),
      ),
    ).toEqual(['weather.pressure: Barometric pressure must be between 50 and 110 kPa']);
    expect(createDynoSessionInputSchema.safeParse({ ...session, sheetNo: 4 }).success).toBe(false);
  });

  it('an update takes any subset but not nothing', () => {
    expect(updateDynoSessionInputSchema.safeParse({ weather: null }).success).toBe(true);
    expect(updateDynoSessionInputSchema.safeParse({}).success).toBe(false);
  });
});

describe('runs', () => {
  it('accepts a complete run, and a stopped one with a reason', () => {
    expect(createDynoRunInputSchema.safeParse(run).success).toBe(true);
    expect(
      createDynoRunInputSchema.safeParse({
        ...run,
        status: 'aborted',
        abortReason: 'Boost leak at the intercooler boot',
        peakPower: null,
        peakPowerRpm: null,
        peakTorque: null,
        peakTorqueRpm: null,
      }).success,
    ).toBe(true);
  });

  it('refuses rpm ≤ 0, negative power or torque, and non-finite numbers', () => {
    expect(issuesOf(createDynoRunInputSchema.safeParse({ ...run, peakPowerRpm: 0 }))).toContain(
      'peakPowerRpm: rpm at peak power must be above zero',
    );
    expect(issuesOf(createDynoRunInputSchema.safeParse({ ...run, peakTorqueRpm: -5 }))).toContain(
      'peakTorqueRpm: rpm at peak torque must be above zero',
    );
    expect(issuesOf(createDynoRunInputSchema.safeParse({ ...run, peakPower: -1 }))).toContain(
      'peakPower: Peak power cannot be negative',
    );
    expect(issuesOf(createDynoRunInputSchema.safeParse({ ...run, peakTorque: -0.5 }))).toContain(
      'peakTorque: Peak torque cannot be negative',
    );
    expect(issuesOf(createDynoRunInputSchema.safeParse({ ...run, peakPower: Infinity }))).toContain(
      'peakPower: Peak power must be a number',
    );
  });

  it('refuses a peak without its rpm, a stopped run without a reason, a complete run with nothing', () => {
    expect(issuesOf(createDynoRunInputSchema.safeParse({ ...run, peakPowerRpm: null }))).toEqual([
      'peakPowerRpm: Enter the rpm at peak power',
    ]);
    expect(issuesOf(createDynoRunInputSchema.safeParse({ ...run, status: 'aborted' }))).toEqual([
      'abortReason: Say why the run was stopped',
    ]);
    expect(
      issuesOf(createDynoRunInputSchema.safeParse({ ...run, abortReason: 'Belt slipped' })),
    ).toEqual(['abortReason: Only a run that was stopped early has a reason']);
    expect(
      issuesOf(
        createDynoRunInputSchema.safeParse({
          ...run,
          peakPower: null,
          peakPowerRpm: null,
          peakTorque: null,
          peakTorqueRpm: null,
        }),
      ),
    ).toEqual(['peakPower: Enter the peak power, peak torque or a curve of a complete run']);
  });

  it('checks boost, EGT and mixture against their units, in the run and in each curve row', () => {
    // 2000 kPa = 290.0755 psi, −100 kPa = −14.5038 psi (psi = 6.894757 kPa, NIST SP 811 (2008) B.9);
    // the message rounds the limits inward so the numbers it shows are accepted.
    expect(createDynoRunInputSchema.safeParse({ ...run, boost: 290 }).success).toBe(true);
    expect(issuesOf(createDynoRunInputSchema.safeParse({ ...run, boost: 291 }))).toEqual([
      'boost: Boost must be between −14.5 and 290.07 psi (−100 to 2000 kPa)',
    ]);
    expect(
      issuesOf(createDynoRunInputSchema.safeParse({ ...run, mixtureKind: 'lambda', mixture: 18 })),
    ).toEqual(['mixture: λ must be between 0.3 and 14']);
    expect(
      issuesOf(
        createDynoRunInputSchema.safeParse({
          ...run,
          curve: [
            { rpm: 2000, power: 300 },
            { rpm: 2100, power: 320, egt: 1500 },
          ],
        }),
      ),
    ).toEqual(['curve.1.egt: Exhaust gas temperature must be between −60 °C and 1400 °C']);
  });

  it('refuses a curve row with neither power nor torque, or rpm ≤ 0', () => {
    expect(issuesOf(curveRowSchema.safeParse({ rpm: 2000 }))).toEqual([
      'power: Give power, torque or both',
    ]);
    expect(issuesOf(curveRowSchema.safeParse({ rpm: 0, torque: 500 }))).toEqual([
      'rpm: rpm must be above zero',
    ]);
    expect(curveRowSchema.parse({ rpm: 2000, torque: 500 })).toEqual({
      rpm: 2000,
      power: null,
      torque: 500,
      boost: null,
      egt: null,
      mixture: null,
    });
  });

  it('refuses a curve of more than 20,000 rows', () => {
    const rows = (n: number) =>
      Array.from({ length: n }, (_, i) => ({ rpm: 1000 + i / 4, power: 300 }));
    expect(
      createDynoRunInputSchema.safeParse({ ...run, curve: rows(MAX_CURVE_ROWS) }).success,
    ).toBe(true);
    expect(
      issuesOf(createDynoRunInputSchema.safeParse({ ...run, curve: rows(MAX_CURVE_ROWS + 1) })),
    ).toEqual(['curve: A curve has at most 20000 rows']);
  });

  it('refuses NUL and over-long text in a run', () => {
    expect(issuesOf(createDynoRunInputSchema.safeParse({ ...run, gear: '3rd\u0000' }))).toEqual([
      `gear: ${nulMessage}`,
    ]);
    expect(
      issuesOf(createDynoRunInputSchema.safeParse({ ...run, tuneRevision: 'r'.repeat(121) })),
    ).toEqual(['tuneRevision: Tune revision must be at most 120 characters']);
  });

  it('an update checks only what it holds; the merged run is checked whole', () => {
    // The stored run may have the rpm: an edit of the peak alone is fine.
    expect(updateDynoRunInputSchema.safeParse({ peakPower: 530 }).success).toBe(true);
    expect(
      issuesOf(updateDynoRunInputSchema.safeParse({ peakPower: 530, peakPowerRpm: null })),
    ).toEqual(['peakPowerRpm: Enter the rpm at peak power']);
    expect(updateDynoRunInputSchema.safeParse({ status: 'aborted' }).success).toBe(true);
    // …and the service checks the merge:
    expect(dynoRunIssues({ ...run, status: 'aborted' })).toEqual([
      { path: ['abortReason'], message: 'Say why the run was stopped' },
    ]);
  });
});

describe('correction choice', () => {
  it('takes a standard and an engine factor within 0.3–1.2', () => {
    expect(
      correctionChoiceSchema.safeParse({ standard: 'ece-r85', engineFactor: 0.66 }).success,
    ).toBe(true);
    expect(
      issuesOf(correctionChoiceSchema.safeParse({ standard: 'ece-r85', engineFactor: 1.3 })),
    ).toEqual(['engineFactor: Engine factor is at most 1.2']);
    expect(issuesOf(correctionChoiceSchema.safeParse({ standard: 'stp' }))).toEqual([
      'standard: Choose a correction standard from the list',
    ]);
  });
});
