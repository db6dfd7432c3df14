import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { benchUnitLabels } from '@shared/bench/units';
import { torqueUnitLabels } from '@shared/install-log/torque';
import {
  barometerUnitLabels,
  boostUnitLabels,
  dynoPowerUnitLabels,
  dynoTorqueUnitLabels,
} from '@shared/schemas/dyno';
import { labelsOf } from '@shared/units/labels';
import {
  HP_TORQUE_RPM_CONSTANT,
  HP_W,
  INHG_KPA,
  KW_TORQUE_RPM_CONSTANT,
  LBF_FT_NM,
  LBF_IN_NM,
  LBF_N,
  LB_PER_HP_H_IN_G_PER_KWH,
  POUND_KG,
  PSI_KPA,
  PS_W,
  US_GALLON_L,
  bsfcUnits,
  convertBsfc,
  convertLength,
  convertMassFlow,
  convertPower,
  convertPressure,
  convertTemperature,
  convertTorque,
  convertVolume,
  convertVolumeFlow,
  hpFromLbft,
  kwFromNm,
  lbftFromHp,
  massFlowUnits,
  nmFromKw,
  powerFromTorque,
  powerUnits,
  pressureUnits,
  torqueFromPower,
  torqueUnits,
  volumeFlowUnits,
  volumeUnits,
} from '@shared/units';

/** |actual − expected| ≤ rel × |expected|. */
// reference.md's full value of lbf·ft → N·m (NIST SP 811 (2008) B.9, from the exact definitions);
// parsed from text because the literal has one more digit than a double holds.
const LBF_FT_NM_REF = Number('1.3558179483314004');

function expectRel(actual: number, expected: number, rel: number) {
  expect(Math.abs(actual - expected), `${actual} vs ${expected}`).toBeLessThanOrEqual(
    rel * Math.abs(expected),
  );
}

/**
 * SP 811 prints seven significant digits: the computed factor must lie within
 * half a unit of the last printed digit (a hair more for exact halves such as
 * 735.49875, which the table rounds up).
 */
function expectAgreesWithPrinted(computed: number, tablePrinted: number, name: string) {
  const lastDigit = 10 ** (Math.floor(Math.log10(Math.abs(tablePrinted))) - 6);
  expect(Math.abs(computed - tablePrinted), name).toBeLessThanOrEqual(0.5 * lastDigit * (1 + 1e-9));
}

describe('factors built from the exact definitions', () => {
  it('match the full values in reference.md and the digits SP 811 prints', () => {
    // Each row: [computed, full value from reference.md, printed in NIST SP 811 (2008)].
    const rows: [string, number, number, number][] = [
      ['lbf·ft → N·m', LBF_FT_NM, LBF_FT_NM_REF, 1.355818], // NIST SP 811 (2008) B.9
      ['lbf·in → N·m', LBF_IN_NM, 0.11298482902761668, 0.1129848], // NIST SP 811 (2008) B.9
      ['lbf → N', LBF_N, 4.4482216152605, 4.448222], // NIST SP 811 (2008) B.9
      ['hp → W', HP_W, 745.69987158227, 745.6999], // NIST SP 811 (2008) B.9
      ['PS → W', PS_W, 735.49875, 735.4988], // NIST SP 811 (2008) B.9
      ['psi → kPa', PSI_KPA, 6.894757293168361, 6.894757], // NIST SP 811 (2008) B.9
      ['inHg → kPa', INHG_KPA, 3.386389, 3.386389], // NIST SP 811 (2008) B.8 (conventional)
      ['lb → kg', POUND_KG, 0.45359237, 0.4535924], // NIST SP 811 (2008) B.8 (exact)
      ['US gal → L', US_GALLON_L, 3.785411784, 3.785412], // NIST SP 811 (2008) B.8 (exact)
    ];
    for (const [name, computed, full, tablePrinted] of rows) {
      // inHg is printed to 7 digits only; its full value is the printed one.
      expectRel(computed, full, name === 'inHg → kPa' ? 5e-7 : 1e-14);
      expectAgreesWithPrinted(computed, tablePrinted, name);
    }
  });

  it('gives 1 lb/(hp·h) = 608.27739 g/kWh', () => {
    // reference.md, units table (derived; 608.277 widely quoted)
    expectRel(LB_PER_HP_H_IN_G_PER_KWH, 608.27739, 1e-8);
    expect(convertBsfc(1, 'lb-per-hp-h', 'g-per-kwh')).toBe(LB_PER_HP_H_IN_G_PER_KWH);
  });
});

describe('convertTorque', () => {
  it('converts between lbf·ft, lbf·in and N·m', () => {
    expectRel(convertTorque(1, 'lbf-ft', 'n-m'), LBF_FT_NM_REF, 1e-15); // NIST SP 811 (2008) B.9
    expectRel(convertTorque(1, 'lbf-in', 'n-m'), 0.11298482902761668, 1e-15); // NIST SP 811 (2008) B.9
    expectRel(convertTorque(1, 'lbf-ft', 'lbf-in'), 12, 1e-15); // ft = 12 in, NIST SP 811 (2008) B.8
    expectRel(convertTorque(1, 'n-m', 'lbf-ft'), 1 / LBF_FT_NM_REF, 1e-15); // NIST SP 811 (2008) B.9
    expect(convertTorque(42, 'n-m', 'n-m')).toBe(42);
  });

  it('reproduces the short-form fastener torque checks', () => {
    // Shigley, Mechanical Engineering Design, ch. 8 (T = K·F·d), via reference.md:
    // K 0.2, d 0.5 in, F 10 000 lbf → 1000 lbf·in = 83.333 lbf·ft = 112.985 N·m.
    const lbfIn = 0.2 * 10_000 * 0.5;
    expect(lbfIn).toBe(1000);
    expect(convertTorque(lbfIn, 'lbf-in', 'lbf-ft')).toBeCloseTo(83.333, 3);
    expect(convertTorque(lbfIn, 'lbf-in', 'n-m')).toBeCloseTo(112.985, 3);
    // K 0.2, M12, 40 kN → 96.0 N·m (Shigley, via reference.md).
    expect(0.2 * 40_000 * convertLength(12, 'mm', 'm')).toBeCloseTo(96.0, 10);
  });

  it('round-trips any torque between any two units', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 1e-6, max: 1e6, noNaN: true }),
        fc.constantFrom(...torqueUnits),
        fc.constantFrom(...torqueUnits),
        (v, a, b) => Math.abs(convertTorque(convertTorque(v, a, b), b, a) - v) <= 1e-12 * v,
      ),
    );
  });
});

describe('power, mass flow, volume, pressure, temperature', () => {
  it('converts power', () => {
    expectRel(convertPower(1, 'hp', 'w'), 745.69987158227, 1e-14); // NIST SP 811 (2008) B.9
    expectRel(convertPower(1, 'hp', 'kw'), 0.74569987158227, 1e-14); // NIST SP 811 (2008) B.9
    expectRel(convertPower(1, 'ps', 'w'), 735.49875, 1e-15); // NIST SP 811 (2008) B.9
    // 291.4286 kW = 390.812 hp: reference.md worked check (fuel from injectors)
    expectRel(convertPower(291.4286, 'kw', 'hp'), 390.812, 1e-6);
  });

  it('converts mass flow', () => {
    // 60 lb/min of air = 60 × 0.45359237 × 60 kg/h; lb exact per NIST SP 811 (2008) B.8
    expectRel(convertMassFlow(60, 'lb-per-min', 'kg-per-h'), 1632.932532, 1e-12);
    expectRel(convertMassFlow(17, 'g-per-s', 'kg-per-h'), 61.2, 1e-14); // reference.md worked check: 17.0 g/s = 61.2 kg/h
    expectRel(convertMassFlow(1, 'lb-per-h', 'kg-per-h'), 0.45359237, 1e-15); // NIST SP 811 (2008) B.8
  });

  it('converts volume and volume flow', () => {
    expect(convertVolume(1, 'us-gal', 'l')).toBe(3.785411784); // NIST SP 811 (2008) B.8, exact
    expectRel(convertVolume(1, 'in3', 'ml'), 16.387064, 1e-14); // NIST SP 811 (2008) B.8: in³ = 1.6387064 E−05 m³ exact
    expectRel(convertVolume(231, 'in3', 'us-gal'), 1, 1e-14); // US gal = 231 in³, NIST SP 811 (2008) B.8
    expectRel(convertVolume(100, 'mm3', 'ml'), 0.1, 1e-15); // SI prefixes
    expectRel(convertVolumeFlow(10, 'gal-per-h', 'l-per-h'), 37.85411784, 1e-15); // NIST SP 811 (2008) B.8
    expectRel(convertVolumeFlow(1, 'l-per-min', 'ml-per-min'), 1000, 1e-15); // SI prefixes
  });

  it('converts pressure', () => {
    expectRel(convertPressure(1, 'psi', 'kpa'), 6.894757293168361, 1e-15); // NIST SP 811 (2008) B.9
    expectRel(convertPressure(1, 'inhg', 'kpa'), 3.386389, 5e-7); // NIST SP 811 (2008) B.8, conventional
    expectRel(convertPressure(29.92, 'inhg', 'mbar'), 1013.208, 1e-6); // from memory: 29.92 inHg ≈ 1013.2 mbar
    expect(convertPressure(1, 'bar', 'kpa')).toBe(100); // SI: bar = 100 kPa (NIST SP 811 (2008) B.8)
  });

  it('converts temperature', () => {
    // NIST SP 811 (2008) 4.2.1.1 and B.8: t[°C] = (t[°F] − 32)/1.8, T[K] = t[°C] + 273.15
    expect(convertTemperature(212, 'f', 'c')).toBe(100);
    expect(convertTemperature(-40, 'f', 'c')).toBe(-40);
    expect(convertTemperature(25, 'c', 'k')).toBeCloseTo(298.15, 12);
    expect(convertTemperature(86, 'f', 'c')).toBeCloseTo(30, 12); // reference.md SAE J607 check uses 86 °F = 30 °C
    expect(convertTemperature(0, 'k', 'f')).toBeCloseTo(-459.67, 10);
  });

  it('round-trips every quantity between any two of its units', () => {
    const kinds = [
      [convertPower, powerUnits],
      [convertMassFlow, massFlowUnits],
      [convertVolume, volumeUnits],
      [convertVolumeFlow, volumeFlowUnits],
      [convertPressure, pressureUnits],
      [convertBsfc, bsfcUnits],
    ] as const;
    for (const [convert, units] of kinds) {
      const f = convert as (v: number, a: string, b: string) => number;
      fc.assert(
        fc.property(
          fc.double({ min: 1e-6, max: 1e6, noNaN: true }),
          fc.constantFrom(...(units as readonly string[])),
          fc.constantFrom(...(units as readonly string[])),
          (v, a, b) => Math.abs(f(f(v, a, b), b, a) - v) <= 1e-12 * v,
        ),
      );
    }
  });
});

describe('BSFC', () => {
  it('converts lb/(hp·h) to g/kWh and back', () => {
    // reference.md: 1 lb/(hp·h) = 608.27739 g/kWh (derived from NIST SP 811 (2008) B.8/B.9)
    expectRel(convertBsfc(0.4, 'lb-per-hp-h', 'g-per-kwh'), 0.4 * 608.27739, 1e-8);
    // common practice range 0.38–0.42 lb/(hp·h) ↔ about 231–255 g/kWh (arithmetic of the factor above)
    expect(convertBsfc(0.38, 'lb-per-hp-h', 'g-per-kwh')).toBeCloseTo(231.145, 2);
    expect(convertBsfc(0.42, 'lb-per-hp-h', 'g-per-kwh')).toBeCloseTo(255.477, 2);
    // van Basshuysen & Schäfer (2005): best point 195 g/kWh ≈ 0.3206 lb/(hp·h)
    expect(convertBsfc(195, 'g-per-kwh', 'lb-per-hp-h')).toBeCloseTo(0.32058, 5);
  });
});

describe('power–torque identity (P = 2πnT/60)', () => {
  it('has the constants 33000/2π and 60000/2π', () => {
    expectRel(HP_TORQUE_RPM_CONSTANT, 5252.113122, 1e-9); // reference.md: 5252.1131220
    expectRel(KW_TORQUE_RPM_CONSTANT, 9549.2965855, 1e-10); // reference.md: 9549.2965855
  });

  it('gives 500 lbf·ft at 2000 rpm = 190.39955 hp = 141.98092 kW', () => {
    // reference.md worked check (rel. 1e-6)
    expectRel(hpFromLbft(500, 2000), 190.39955, 1e-6);
    expectRel(powerFromTorque(500, 'lbf-ft', 2000, 'kw'), 141.98092, 1e-6);
    expectRel(powerFromTorque(500, 'lbf-ft', 2000, 'hp'), 190.39955, 1e-6);
    expectRel(lbftFromHp(190.39955, 2000), 500, 1e-6);
  });

  it('gives 1000 N·m at 2000 rpm = 209.43951 kW', () => {
    // reference.md worked check
    expectRel(kwFromNm(1000, 2000), 209.43951, 1e-7);
    expectRel(nmFromKw(209.43951, 2000), 1000, 1e-7);
    expectRel(torqueFromPower(209.43951, 'kw', 2000, 'n-m'), 1000, 1e-7);
  });

  it('agrees between the hp and SI forms at any torque and speed', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 1, max: 5000, noNaN: true }),
        fc.integer({ min: 500, max: 8000 }),
        (t, rpm) => {
          const viaHp = hpFromLbft(t, rpm);
          const viaSi = convertPower(kwFromNm(convertTorque(t, 'lbf-ft', 'n-m'), rpm), 'kw', 'hp');
          return Math.abs(viaHp - viaSi) <= 1e-12 * viaHp;
        },
      ),
    );
  });
});

// Unit symbols as NIST SP 811 (2008) writes them (§ 6.1.2 and Table 5: N·m, kPa, MPa, °C, K;
// a centred dot for a product), with US customary units as the screens speak them (lbf·ft first).
describe('unit labels: one map, typed views of it', () => {
  it('writes each symbol as NIST SP 811 does', () => {
    expect(labelsOf(['n-m', 'lbf-ft', 'lbf-in'])).toEqual({
      'n-m': 'N·m',
      'lbf-ft': 'lbf·ft',
      'lbf-in': 'lbf·in',
    });
    expect(labelsOf(['kpa', 'mpa', 'psi', 'c', 'k'])).toEqual({
      kpa: 'kPa',
      mpa: 'MPa',
      psi: 'psi',
      c: '°C',
      k: 'K',
    });
  });

  it('gives the torque, dyno and bench pickers the same words, a picker changing only its own', () => {
    expect(torqueUnitLabels['lbf-ft']).toBe(dynoTorqueUnitLabels['lbf-ft']);
    expect(boostUnitLabels.kpa).toBe('kPa');
    expect(barometerUnitLabels).toEqual({
      kpa: 'kPa',
      mbar: 'mbar (hPa)',
      inhg: 'inHg',
      psi: 'psi',
    });
    expect(dynoPowerUnitLabels).toEqual({ hp: 'hp', kw: 'kW', ps: 'PS (metric hp)' });
    expect(benchUnitLabels.mpa).toBe('MPa');
  });
});
