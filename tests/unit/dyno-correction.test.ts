import { describe, expect, it } from 'vitest';
import {
  DEFAULT_ENGINE_FACTOR,
  ambientFromWeather,
  correctionFactor,
  din70020Factor,
  dryAirPressure,
  r85AtmosphericFactor,
  r85EngineFactor,
  r85EngineFactorForRun,
  r85Factor,
  r85FactorValid,
  sae1349Factor,
  sae607Factor,
  saturationVapourPressureKpa,
  vapourPressure,
  type EngineFactorRunInput,
} from '@shared/dyno';
import type { Weather } from '@shared/schemas/dyno';

function expectRel(actual: number, expected: number, rel: number) {
  expect(Math.abs(actual - expected), `${actual} vs ${expected}`).toBeLessThanOrEqual(
    rel * Math.abs(expected),
  );
}

const dry = (temperature: number, pressure: number): Weather => ({
  temperature,
  temperatureUnit: 'c',
  pressure,
  pressureUnit: 'kpa',
});

describe('saturation vapour pressure (Buck)', () => {
  it('agrees with the CRC Handbook table within 0.05 % from 0 to 40 °C', () => {
    // CRC Handbook of Chemistry and Physics, 73rd ed. (1992–93), "Vapor Pressure of Water"
    // (as reproduced at lcm91.tripod.com/documents/vp_H2O.htm), kPa.
    const table: [number, number][] = [
      [0, 0.61129],
      [10, 1.2281],
      [20, 2.3388],
      [30, 4.2455],
      [40, 7.3814],
    ];
    for (const [t, kpa] of table) {
      // Buck's equation is a fit good to a few hundredths of a percent over 0–50 °C.
      expectRel(saturationVapourPressureKpa(t), kpa, 5e-4);
    }
  });

  it('gives p_v = RH/100 × e_s(t), and the same p_v from the matching dew point', () => {
    // RH 50 % at 30 °C: half of the CRC table's 4.2455 kPa (CRC 73rd ed. "Vapor Pressure of Water").
    const rh = vapourPressure({ ...dry(30, 100), relativeHumidityPct: 50 });
    expectRel(rh.value, 0.5 * 4.2455, 5e-4);
    expect(rh.working.formula).toContain('RH/100');
    // Dew point 20 °C: p_v is the saturation pressure at 20 °C, CRC table 2.3388 kPa.
    const dp = vapourPressure({ ...dry(30, 100), dewPoint: 20 });
    expectRel(dp.value, 2.3388, 5e-4);
    expect(dp.working.formula).toContain('e_s(t_d)');
  });

  it('takes the air as dry (p_v = 0) and says so when no humidity is recorded', () => {
    const w = dry(25, 99);
    expect(vapourPressure(w).value).toBe(0);
    expect(dryAirPressure(w).value).toBe(99);
    expect(dryAirPressure(w).working.formula).toContain('no humidity');
  });

  it('converts °F and inHg with the NIST factors before the formula', () => {
    // 86 °F = 30 °C ((86 − 32)/1.8, NIST SP 811 (2008) B.8); 29.00 inHg × 3.386389 kPa (NIST SP 811 B.8).
    const a = ambientFromWeather({
      temperature: 86,
      temperatureUnit: 'f',
      pressure: 29,
      pressureUnit: 'inhg',
    });
    expectRel(a.temperatureC, 30, 1e-12);
    // SP 811 prints 7 digits of the inHg factor, so agree to half a unit in the last: 5e-7.
    expectRel(a.pressureKpa, 29 * 3.386389, 5e-7);
    expect(a.steps.map((s) => s.label)).toEqual([
      'Air temperature in °C',
      'Barometric pressure in kPa',
    ]);
  });
});

describe('SAE J1349 (AUG2004)', () => {
  it('matches the reference.md check values', () => {
    // reference.md, "Dynamometer correction", SAE J1349 checks (t °C, p_d kPa).
    expectRel(sae1349Factor(25, 99), 1.0, 1e-6);
    expectRel(sae1349Factor(30, 97), 1.0343913, 1e-6);
    expectRel(sae1349Factor(35, 95), 1.0701463, 1e-6);
    expectRel(sae1349Factor(15, 100), 0.9684321, 1e-6);
  });

  it('gives the same through the weather record, and warns that no humidity means dry air', () => {
    // reference.md J1349 check (30 °C, 97 kPa) → 1.0343913.
    const r = correctionFactor({ standard: 'sae-j1349', weather: dry(30, 97) });
    expectRel(r.factor, 1.0343913, 1e-6);
    expect(r).toMatchObject({ applied: true, valid: true, message: null });
    expect(r.warnings.map((w) => w.code)).toEqual(['no-humidity']);
    expect(r.working.formula).toContain('1.18 × (99 / p_d)');
    expect(r.working.constants.map((c) => c.value)).toEqual(
      expect.arrayContaining([1.18, 99, 273, 298, 0.18]),
    );
    expect(r.working.constants.every((c) => c.source.length > 0)).toBe(true);
  });

  it('uses dry-air pressure: 30 °C, dew point 20 °C at 99.3388 kPa is the (30, 97) check', () => {
    // p_v = e_s(20 °C) = 2.3388 kPa (CRC Handbook, 73rd ed., "Vapor Pressure of Water"), so
    // p_d = 99.3388 − 2.3388 = 97 kPa → reference.md J1349 check (30, 97) → 1.0343913.
    // Buck differs from the table by 0.02 % of p_v, i.e. 5e-6 of p_d.
    const r = correctionFactor({
      standard: 'sae-j1349',
      weather: { ...dry(30, 99.3388), dewPoint: 20 },
    });
    expectRel(r.factor, 1.0343913, 2e-5);
    expect(r.warnings).toEqual([]);
    expect(r.working.steps.map((s) => s.label)).toContain('Dry-air pressure');
  });
});

describe('UN ECE R85 / ISO 1585', () => {
  it('atmospheric factor at 30 °C, 97 kPa matches reference.md', () => {
    // reference.md, "Dynamometer correction", R85 checks at 30 °C, 97 kPa.
    expectRel(r85AtmosphericFactor(30, 97, 'turbocharged'), 1.0400255, 1e-6);
    expectRel(r85AtmosphericFactor(30, 97, 'naturally-aspirated'), 1.0325757, 1e-6);
  });

  it('α_d = f_a^f_m matches reference.md for f_m 0.66, 1.2 and 0.3', () => {
    // reference.md R85 checks: f_m 0.66 → 1.0262402, 1.2 → 1.0482208, 0.3 → 1.0118431.
    const fa = r85AtmosphericFactor(30, 97, 'turbocharged');
    expectRel(r85Factor(fa, 0.66), 1.0262402, 1e-6);
    expectRel(r85Factor(fa, 1.2), 1.0482208, 1e-6);
    expectRel(r85Factor(fa, 0.3), 1.0118431, 1e-6);
  });

  it('with a chosen f_m, says it was chosen; with none, uses 0.3 and says so', () => {
    // reference.md R85 checks at 30 °C, 97 kPa, turbocharged.
    const chosen = correctionFactor({
      standard: 'ece-r85',
      weather: dry(30, 97),
      r85: { aspiration: 'turbocharged', chosenEngineFactor: 0.66 },
    });
    expectRel(chosen.factor, 1.0262402, 1e-6);
    expect(chosen.engineFactor).toMatchObject({ value: 0.66, source: 'chosen', qc: null });
    expect(chosen.warnings.map((w) => w.code)).toContain('engine-factor-chosen');

    const fallback = correctionFactor({
      standard: 'ece-r85',
      weather: dry(30, 97),
      r85: { aspiration: 'turbocharged' },
    });
    expect(DEFAULT_ENGINE_FACTOR).toBe(0.3);
    expectRel(fallback.factor, 1.0118431, 1e-6);
    expect(fallback.engineFactor?.source).toBe('default');
    expect(fallback.warnings.map((w) => w.code)).toContain('engine-factor-default');
  });

  it('f_m follows its three branches at the q_c edges 37.2 and 65', () => {
    // reference.md: f_m = 0.036·q_c − 1.14 for 37.2 ≤ q_c ≤ 65; 0.3 below; 1.2 above. By hand:
    expectRel(r85EngineFactor(37.2), 0.036 * 37.2 - 1.14, 1e-12); // on the line: 0.1992
    expectRel(r85EngineFactor(37.2), 0.1992, 1e-9);
    expect(r85EngineFactor(37.19)).toBe(0.3); // below the line
    expect(r85EngineFactor(0)).toBe(0.3);
    expectRel(r85EngineFactor(50), 0.66, 1e-12); // 0.036 × 50 − 1.14
    expectRel(r85EngineFactor(65), 1.2, 1e-12); // 0.036 × 65 − 1.14 = 2.34 − 1.14
    expect(r85EngineFactor(65.01)).toBe(1.2); // above the line
    expect(r85EngineFactor(500)).toBe(1.2);
  });

  it('computes f_m from a run: 180 kW crank, 200 g/kWh, 6 L, 2000 rpm, 97 kPa boost → q_c 50', () => {
    // By hand: fuel = 180 × 200 / 3600 = 10 g/s; q = 120000 × 10 / (6 × 2000) = 100 mg/(L·cycle);
    // r = (97 + 97) / 97 = 2; q_c = 50; f_m = 0.036 × 50 − 1.14 = 0.66.
    // At 30 °C, 97 kPa dry, turbocharged: α_d = 1.0262402 (reference.md R85 check, f_m 0.66).
    const run: EngineFactorRunInput = {
      power: 180,
      powerUnit: 'kw',
      rpm: 2000,
      basis: 'crank',
      bsfc: 200,
      bsfcUnit: 'g-per-kwh',
      displacementL: 6,
      boost: 97,
      boostUnit: 'kpa',
    };
    const fm = r85EngineFactorForRun({ aspiration: 'turbocharged', run }, 97);
    expect(fm.source).toBe('computed');
    expectRel(fm.qc!, 50, 1e-12);
    expectRel(fm.value, 0.66, 1e-12);
    const byStep = Object.fromEntries(fm.working.steps.map((s) => [s.label, s.value]));
    expectRel(byStep['Fuel flow'], 10, 1e-12);
    expectRel(byStep['Fuel delivery per litre and cycle'], 100, 1e-12);
    expectRel(byStep['Boost pressure ratio'], 2, 1e-12);

    const r = correctionFactor({
      standard: 'ece-r85',
      weather: dry(30, 97),
      // A chosen f_m is ignored when the run gives what q_c needs.
      r85: { aspiration: 'turbocharged', run, chosenEngineFactor: 1.2 },
    });
    expectRel(r.factor, 1.0262402, 1e-6);
    expect(r.engineFactor?.source).toBe('computed');
    expect(r.warnings.map((w) => w.code)).toEqual(['no-humidity']);
  });

  it('takes a chassis-dyno figure back to the crank with the drivetrain loss', () => {
    // 153 wheel kW with 15 % loss = 180 crank kW (153 / 0.85): the same q_c 50 as above.
    const run: EngineFactorRunInput = {
      power: 153,
      powerUnit: 'kw',
      rpm: 2000,
      basis: 'wheel',
      drivetrainLossPct: 15,
      bsfc: 200,
      bsfcUnit: 'g-per-kwh',
      displacementL: 6,
      boost: 97,
      boostUnit: 'kpa',
    };
    expectRel(r85EngineFactorForRun({ aspiration: 'turbocharged', run }, 97).qc!, 50, 1e-12);
    const noLoss = r85EngineFactorForRun(
      { aspiration: 'turbocharged', run: { ...run, drivetrainLossPct: null } },
      97,
    );
    expect(noLoss.source).toBe('default');
    expect(noLoss.reason).toContain('drivetrain loss');
  });

  it('falls back to the chosen f_m and names what is missing', () => {
    const fm = r85EngineFactorForRun(
      {
        aspiration: 'turbocharged',
        chosenEngineFactor: 0.5,
        run: {
          power: 400,
          powerUnit: 'hp',
          rpm: 3000,
          basis: 'crank',
          bsfc: 0.4,
          bsfcUnit: 'lb-per-hp-h',
          displacementL: null,
          boost: null,
          boostUnit: 'psi',
        },
      },
      97,
    );
    expect(fm).toMatchObject({ value: 0.5, source: 'chosen', qc: null });
    expect(fm.reason).toContain('the engine displacement');
    expect(fm.reason).toContain('the boost at peak power');
  });

  it('refuses a chosen f_m outside 0.3–1.2', () => {
    expect(() =>
      correctionFactor({
        standard: 'ece-r85',
        weather: dry(30, 97),
        r85: { aspiration: 'turbocharged', chosenEngineFactor: 1.5 },
      }),
    ).toThrow(RangeError);
  });

  it('flags α_d outside 0.9–1.1 but still returns it, unclipped', () => {
    // reference.md: valid only for 0.9 ≤ α_d ≤ 1.1 (outside: say so, do not extrapolate silently).
    expect(r85FactorValid(0.9)).toBe(true);
    expect(r85FactorValid(1.1)).toBe(true);
    expect(r85FactorValid(0.8999999)).toBe(false);
    expect(r85FactorValid(1.1000001)).toBe(false);

    // 50 °C, 70 kPa dry, f_m 1.2: f_a = (99/70)^0.7 × (323/298)^1.5 by hand.
    const faHot = (99 / 70) ** 0.7 * (323 / 298) ** 1.5;
    const hot = correctionFactor({
      standard: 'ece-r85',
      weather: dry(50, 70),
      r85: { aspiration: 'turbocharged', chosenEngineFactor: 1.2 },
    });
    expectRel(hot.factor, faHot ** 1.2, 1e-12);
    expect(hot.factor).toBeGreaterThan(1.1);
    expect(hot.valid).toBe(false);
    expect(hot.applied).toBe(true);
    expect(hot.message).toMatch(/outside the 0\.9 to 1\.1 range/);
    expect(hot.warnings.map((w) => w.code)).toContain('outside-valid-range');

    // −40 °C, 105 kPa dry, f_m 1.2: below 0.9.
    const cold = correctionFactor({
      standard: 'ece-r85',
      weather: dry(-40, 105),
      r85: { aspiration: 'turbocharged', chosenEngineFactor: 1.2 },
    });
    expect(cold.factor).toBeLessThan(0.9);
    expect(cold.valid).toBe(false);

    // The reference day is inside.
    const ok = correctionFactor({
      standard: 'ece-r85',
      weather: dry(30, 97),
      r85: { aspiration: 'turbocharged', chosenEngineFactor: 1.2 },
    });
    expect(ok).toMatchObject({ valid: true, message: null });
  });
});

describe('SAE J607 and DIN 70020 (older records)', () => {
  it('J607 (86 °F, 29.00 inHg) → 1.0572026', () => {
    // reference.md, "Dynamometer correction", SAE J607 [memory] check.
    expectRel(sae607Factor(86, 29), 1.0572026, 1e-6);
    const r = correctionFactor({
      standard: 'sae-j607',
      weather: { temperature: 86, temperatureUnit: 'f', pressure: 29, pressureUnit: 'inhg' },
    });
    expectRel(r.factor, 1.0572026, 1e-6);
    expect(r.working.formula).toContain('total barometric pressure');
  });

  it('J607 from °C and kPa converts with the NIST factors first', () => {
    // 30 °C = 86 °F; 29.00 inHg = 98.205281 kPa (3.386389 kPa/inHg, NIST SP 811 (2008) B.8).
    // reference.md J607 check (86 °F, 29.00 inHg) → 1.0572026.
    const r = correctionFactor({ standard: 'sae-j607', weather: dry(30, 29 * 3.386389) });
    expectRel(r.factor, 1.0572026, 1e-6);
  });

  it('DIN 70020 (30 °C, 970 mbar) → 1.0620017, humidity not used', () => {
    // reference.md, "Dynamometer correction", DIN 70020 [memory] check.
    expectRel(din70020Factor(30, 970), 1.0620017, 1e-6);
    const r = correctionFactor({
      standard: 'din-70020',
      weather: {
        temperature: 30,
        temperatureUnit: 'c',
        pressure: 970,
        pressureUnit: 'mbar',
        relativeHumidityPct: 80,
      },
    });
    expectRel(r.factor, 1.0620017, 1e-6);
    expect(r.warnings).toEqual([]);
  });
});

describe('uncorrected and missing weather', () => {
  it('uncorrected is factor 1', () => {
    const r = correctionFactor({ standard: 'uncorrected', weather: dry(35, 90) });
    expect(r).toMatchObject({ factor: 1, applied: true, valid: true, engineFactor: null });
  });

  it('without weather a standard is not applied: factor 1, and it says so', () => {
    const r = correctionFactor({ standard: 'sae-j1349', weather: null });
    expect(r).toMatchObject({ factor: 1, applied: false });
    expect(r.message).toMatch(/No weather was recorded/);
    expect(r.warnings.map((w) => w.code)).toEqual(['no-weather']);
  });
});
