import { describe, expect, it } from 'vitest';
import { completeCurve, curvePeaks } from '@shared/dyno';
import { convertPressure, convertTemperature } from '@shared/units';
import type { CurveRow } from '@shared/schemas/dyno';

function expectRel(actual: number, expected: number, rel: number) {
  expect(Math.abs(actual - expected), `${actual} vs ${expected}`).toBeLessThanOrEqual(
    rel * Math.abs(expected),
  );
}

const row = (rpm: number, power: number | null, torque: number | null): CurveRow => ({
  rpm,
  power,
  torque,
  boost: null,
  egt: null,
  mixture: null,
});

describe('weather units against NIST SP 811 (2008)', () => {
  it('inch of mercury (conventional) = 3.386389 kPa', () => {
    // NIST SP 811 (2008) B.8, "inch of mercury, conventional": 3.386389 E+03 Pa (printed to 7 digits).
    expectRel(convertPressure(1, 'inhg', 'kpa'), 3.386389, 5e-7);
    expectRel(convertPressure(29.92, 'inhg', 'kpa'), 29.92 * 3.386389, 5e-7);
  });

  it('millibar = 100 Pa exactly', () => {
    // NIST SP 811 (2008) B.8, "millibar (mbar)": 1.0 E+02 Pa (exact).
    expect(convertPressure(1013.25, 'mbar', 'kpa')).toBeCloseTo(101.325, 12);
    expect(convertPressure(97, 'kpa', 'mbar')).toBeCloseTo(970, 10);
  });

  it('standard atmosphere 101.325 kPa = 29.92126 inHg = 14.69595 psi', () => {
    // NIST SP 811 (2008) B.8: atmosphere, standard = 1.01325 E+05 Pa (exact);
    // ÷ 3.386389 kPa/inHg (B.8) and ÷ 6.894757 kPa/psi (B.9).
    expectRel(convertPressure(101.325, 'kpa', 'inhg'), 101.325 / 3.386389, 5e-7);
    expectRel(convertPressure(101.325, 'kpa', 'psi'), 101.325 / 6.894757, 5e-7);
  });

  it('psi = 6.894757 kPa; bar = 100 kPa', () => {
    // NIST SP 811 (2008) B.9, "pound-force per square inch (psi)": 6.894757 E+03 Pa;
    // B.8, "bar": 1.0 E+05 Pa (exact).
    expectRel(convertPressure(1, 'psi', 'kpa'), 6.894757, 5e-7);
    expectRel(convertPressure(30, 'psi', 'bar'), (30 * 6.894757) / 100, 5e-7);
  });

  it('°F → °C is (t − 32)/1.8', () => {
    // NIST SP 811 (2008) B.8 / 4.2.1.1: t/°C = (t/°F − 32)/1.8.
    expect(convertTemperature(86, 'f', 'c')).toBeCloseTo(30, 12);
    expect(convertTemperature(-40, 'f', 'c')).toBeCloseTo(-40, 12);
    expect(convertTemperature(140, 'f', 'c')).toBeCloseTo(60, 12);
    expect(convertTemperature(-76, 'f', 'c')).toBeCloseTo(-60, 12);
  });
});

describe('power and torque on a curve (P = 2πnT/60)', () => {
  it('500 lbf·ft at 2000 rpm = 190.39955 hp = 141.98092 kW', () => {
    // reference.md, "Power and torque", definition of power check (rel. 1e-6).
    const [hp] = completeCurve([row(2000, null, 500)], 'hp', 'lbf-ft');
    expectRel(hp.power, 190.39955, 1e-6);
    expect(hp.computed).toBe('power');
    const [kw] = completeCurve([row(2000, null, 500)], 'kw', 'lbf-ft');
    expectRel(kw.power, 141.98092, 1e-6);
  });

  it('1000 N·m at 2000 rpm = 209.43951 kW, and back', () => {
    // reference.md, "Power and torque", definition of power check.
    const [kw] = completeCurve([row(2000, null, 1000)], 'kw', 'n-m');
    expectRel(kw.power, 209.43951, 1e-6);
    const [nm] = completeCurve([row(2000, 209.43951, null)], 'kw', 'n-m');
    expectRel(nm.torque, 1000, 1e-6);
    expect(nm.computed).toBe('torque');
    // In PS: 209.43951 kW ÷ 0.73549875 kW/PS (PS = 735.49875 W, NIST SP 811 (2008) B.9).
    const [ps] = completeCurve([row(2000, null, 1000)], 'ps', 'n-m');
    expectRel(ps.power, 209.43951 / 0.73549875, 1e-6);
  });

  it('hp = lbf·ft × rpm / 5252.1131220, so power and torque cross at 5252 rpm', () => {
    // reference.md: hp = T[lbf·ft] × rpm / 5252.1131220 (33000/2π).
    const [r] = completeCurve([row(5252.113122, null, 400)], 'hp', 'lbf-ft');
    expectRel(r.power, 400, 1e-9);
  });

  it('keeps both values when a row has both, and finds the peaks with their rpm', () => {
    const rows = [
      row(3000, 480, null),
      row(2000, null, 1050),
      row(2500, 500, 1040), // both given: kept as typed, not recomputed
      row(3200, 470, null),
    ];
    const full = completeCurve(rows, 'hp', 'lbf-ft');
    expect(full.map((r) => r.rpm)).toEqual([2000, 2500, 3000, 3200]);
    expect(full[1]).toMatchObject({ power: 500, torque: 1040, computed: null });
    const peaks = curvePeaks(rows, 'hp', 'lbf-ft');
    expect(peaks).toMatchObject({ power: 500, powerRpm: 2500, powerSource: 'curve' });
    // 1050 lbf·ft at 2000 rpm is the highest torque; 480 hp at 3000 rpm is
    // 480 × 5252.113 / 3000 = 840.3 lbf·ft (reference.md), lower.
    expect(peaks).toMatchObject({ torque: 1050, torqueRpm: 2000, torqueSource: 'curve' });
  });
});
