import { describe, expect, it } from 'vitest';
import {
  EDGE_EPSILON,
  convertTorque,
  describeTarget,
  judgeTorque,
  otherSystemUnit,
  restateTarget,
  toleranceBand,
  type TorqueTarget,
} from '@shared/install-log/torque';

const spec = (
  targetValue: number,
  targetUnit: TorqueTarget['targetUnit'],
  toleranceType: TorqueTarget['toleranceType'],
  toleranceValue: number,
): TorqueTarget => ({
  targetValue,
  targetUnit,
  toleranceType,
  toleranceValue,
});

/** lbf·ft → N·m from the exact definitions: lb 0.45359237 kg × g_n 9.80665 m/s² × ft 0.3048 m (NIST SP 811 (2008) B.8/B.9). */
const LBF_FT_NM_EXACT = 0.45359237 * 9.80665 * 0.3048;

/** Relative agreement to the digits a printed table shows. */
const closeTo = (actual: number, printed: number, digits: number) =>
  expect(Math.abs(actual - printed) / printed).toBeLessThan(0.5 * 10 ** -(digits - 1));

describe('torque conversion', () => {
  it('agrees with the printed factors of NIST SP 811', () => {
    closeTo(convertTorque(1, 'lbf-ft', 'n-m'), 1.355818, 7); // NIST SP 811 (2008) B.9: lbf·ft → N·m 1.355818
    closeTo(convertTorque(1, 'lbf-in', 'n-m'), 0.1129848, 7); // NIST SP 811 (2008) B.9: lbf·in → N·m 0.1129848
  });

  it('uses the factors built from the exact definitions', () => {
    // NIST SP 811 (2008) B.8: ft = 0.3048 m, lb = 0.45359237 kg; g_n = 9.80665 m/s² (3rd CGPM 1901)
    expect(convertTorque(1, 'lbf-ft', 'n-m')).toBeCloseTo(0.45359237 * 9.80665 * 0.3048, 15);
    // reference.md, exact-definition factor 1.3558179483314004 (17 digits: written as text, a literal trips no-loss-of-precision)
    expect(convertTorque(1, 'lbf-ft', 'n-m')).toBeCloseTo(Number('1.3558179483314004'), 15);
    expect(convertTorque(1, 'lbf-in', 'n-m')).toBeCloseTo(0.11298482902761668, 16); // reference.md, exact-definition factor
    expect(convertTorque(1, 'lbf-ft', 'lbf-in')).toBeCloseTo(12, 12); // 1 ft = 12 in exactly, NIST SP 811 (2008) B.8
  });

  it('reproduces the short-form bolt example in three units', () => {
    // Shigley, Mechanical Engineering Design, ch. 8 (T = K·F·d): K 0.2, d 0.5 in, F 10 000 lbf
    const lbfIn = 0.2 * 10_000 * 0.5;
    expect(lbfIn).toBe(1000);
    expect(convertTorque(lbfIn, 'lbf-in', 'lbf-ft')).toBeCloseTo(83.333, 3); // Shigley check via reference.md: 83.333 lbf·ft
    expect(convertTorque(lbfIn, 'lbf-in', 'n-m')).toBeCloseTo(112.985, 3); // Shigley check via reference.md: 112.985 N·m
  });

  it('round-trips without drift beyond float error', () => {
    for (const v of [1, 25, 47.5, 300, 1234.5]) {
      expect(convertTorque(convertTorque(v, 'lbf-ft', 'n-m'), 'n-m', 'lbf-ft')).toBeCloseTo(v, 10);
    }
  });
});

describe('tolerance band', () => {
  it('is ± an amount in the spec unit, or ± a percentage of the target', () => {
    expect(toleranceBand(spec(60, 'n-m', 'value', 3))).toEqual({ low: 57, high: 63, unit: 'n-m' });
    expect(toleranceBand(spec(100, 'lbf-ft', 'percent', 5))).toEqual({
      low: 95,
      high: 105,
      unit: 'lbf-ft',
    });
  });

  it('restates a spec in the other unit system for the step page', () => {
    expect(otherSystemUnit('lbf-ft')).toBe('n-m');
    expect(otherSystemUnit('lbf-in')).toBe('n-m');
    expect(otherSystemUnit('n-m')).toBe('lbf-ft');
    const alt = restateTarget(spec(100, 'lbf-ft', 'percent', 5), 'n-m');
    expect(alt.target).toBeCloseTo(135.58179483314004, 10); // NIST SP 811 (2008) B.9: 100 × 1.355818
    expect(alt.low).toBeCloseTo(95 * LBF_FT_NM_EXACT, 10);
    expect(alt.high).toBeCloseTo(105 * LBF_FT_NM_EXACT, 10);
    expect(describeTarget(spec(100, 'lbf-ft', 'percent', 5))).toBe('100 lbf·ft ± 5 %');
    expect(describeTarget(spec(60, 'n-m', 'value', 3))).toBe('60 N·m ± 3 N·m');
  });
});

describe('judging a reading', () => {
  it('marks readings in the spec unit in spec, under or over', () => {
    const s = spec(60, 'n-m', 'value', 3);
    expect(judgeTorque({ value: 60, unit: 'n-m' }, s)).toMatchObject({
      verdict: 'in-spec',
      deviation: 0,
    });
    expect(judgeTorque({ value: 56, unit: 'n-m' }, s)).toMatchObject({
      verdict: 'under',
      deviation: -4,
    });
    expect(judgeTorque({ value: 64, unit: 'n-m' }, s).verdict).toBe('over');
  });

  it('converts a reading taken in another unit before judging it', () => {
    const s = spec(100, 'lbf-ft', 'percent', 5); // band 95–105 lbf·ft
    // 135 N·m = 99.57 lbf·ft (NIST SP 811 (2008) B.9: 1 lbf·ft = 1.355818 N·m)
    const nm = judgeTorque({ value: 135, unit: 'n-m' }, s);
    expect(nm.verdict).toBe('in-spec');
    expect(nm.valueInSpecUnit).toBeCloseTo(135 / LBF_FT_NM_EXACT, 10);
    // 125 N·m = 92.19 lbf·ft: under; 145 N·m = 106.95 lbf·ft: over
    expect(judgeTorque({ value: 125, unit: 'n-m' }, s).verdict).toBe('under');
    expect(judgeTorque({ value: 145, unit: 'n-m' }, s).verdict).toBe('over');
    // 1200 lbf·in = 100 lbf·ft exactly (NIST SP 811 (2008) B.8: ft = 12 in)
    expect(judgeTorque({ value: 1200, unit: 'lbf-in' }, s)).toMatchObject({ verdict: 'in-spec' });
    expect(judgeTorque({ value: 1200, unit: 'lbf-in' }, s).valueInSpecUnit).toBeCloseTo(100, 12);
    // An N·m spec read with an lbf·ft wrench: 50 lbf·ft = 67.79 N·m against 68 ± 2 N·m
    expect(judgeTorque({ value: 50, unit: 'lbf-ft' }, spec(68, 'n-m', 'value', 2)).verdict).toBe(
      'in-spec',
    );
    expect(judgeTorque({ value: 48, unit: 'lbf-ft' }, spec(68, 'n-m', 'value', 2)).verdict).toBe(
      'under',
    ); // 65.08 N·m
  });

  it('reports the deviation in the spec unit and as a percentage', () => {
    const j = judgeTorque({ value: 103, unit: 'lbf-ft' }, spec(100, 'lbf-ft', 'percent', 5));
    expect(j.deviation).toBeCloseTo(3, 12);
    expect(j.deviationPercent).toBeCloseTo(3, 12);
  });
});

describe('the tolerance edge is in spec', () => {
  it('counts readings exactly on a ± value edge as in spec, and just outside as out', () => {
    const s = spec(60, 'n-m', 'value', 3);
    expect(judgeTorque({ value: 57, unit: 'n-m' }, s).verdict).toBe('in-spec');
    expect(judgeTorque({ value: 63, unit: 'n-m' }, s).verdict).toBe('in-spec');
    expect(judgeTorque({ value: 56.99, unit: 'n-m' }, s).verdict).toBe('under');
    expect(judgeTorque({ value: 63.01, unit: 'n-m' }, s).verdict).toBe('over');
  });

  it('counts readings exactly on a ± % edge as in spec, and just outside as out', () => {
    const s = spec(100, 'lbf-ft', 'percent', 5);
    expect(judgeTorque({ value: 95, unit: 'lbf-ft' }, s).verdict).toBe('in-spec');
    expect(judgeTorque({ value: 105, unit: 'lbf-ft' }, s).verdict).toBe('in-spec');
    expect(judgeTorque({ value: 94.99, unit: 'lbf-ft' }, s).verdict).toBe('under');
    expect(judgeTorque({ value: 105.01, unit: 'lbf-ft' }, s).verdict).toBe('over');
  });

  it('keeps a typed edge in spec where float arithmetic of the band lands a hair inside it', () => {
    // 13.6 ± 0.2 N·m: 13.6 + 0.2 is 13.799999999999999 in binary floating point.
    expect(13.6 + 0.2).toBeLessThan(13.8);
    expect(judgeTorque({ value: 13.8, unit: 'n-m' }, spec(13.6, 'n-m', 'value', 0.2)).verdict).toBe(
      'in-spec',
    );
    expect(
      judgeTorque({ value: 13.81, unit: 'n-m' }, spec(13.6, 'n-m', 'value', 0.2)).verdict,
    ).toBe('over');
    // 89 N·m ± 11 %: the computed top of the band is 98.78999999999999.
    expect(89 + (89 * 11) / 100).toBeLessThan(98.79);
    expect(judgeTorque({ value: 98.79, unit: 'n-m' }, spec(89, 'n-m', 'percent', 11)).verdict).toBe(
      'in-spec',
    );
    expect(judgeTorque({ value: 98.8, unit: 'n-m' }, spec(89, 'n-m', 'percent', 11)).verdict).toBe(
      'over',
    );
  });

  it('keeps an edge read in another unit in spec although the conversion lands a hair outside', () => {
    // 35 lbf·ft ± 10 %: bottom edge 31.5 lbf·ft = 378 lbf·in exactly (NIST SP 811 (2008) B.8: ft = 12 in).
    expect(convertTorque(378, 'lbf-in', 'lbf-ft')).toBeLessThan(31.5); // 31.499999999999996
    expect(
      judgeTorque({ value: 378, unit: 'lbf-in' }, spec(35, 'lbf-ft', 'percent', 10)).verdict,
    ).toBe('in-spec');
    expect(
      judgeTorque({ value: 377.9, unit: 'lbf-in' }, spec(35, 'lbf-ft', 'percent', 10)).verdict,
    ).toBe('under');
    // 65 lbf·ft ± 5 %: bottom edge 61.75 lbf·ft, read as its N·m equivalent (× LBF_FT_NM_EXACT, NIST SP 811 (2008) B.9).
    const edgeNm = 61.75 * LBF_FT_NM_EXACT;
    expect(convertTorque(edgeNm, 'n-m', 'lbf-ft')).toBeLessThan(61.75);
    expect(
      judgeTorque({ value: edgeNm, unit: 'n-m' }, spec(65, 'lbf-ft', 'percent', 5)).verdict,
    ).toBe('in-spec');
    expect(
      judgeTorque({ value: edgeNm - 0.01, unit: 'n-m' }, spec(65, 'lbf-ft', 'percent', 5)).verdict,
    ).toBe('under');
    // 44 lbf·ft ± 10 %: top edge 48.4 lbf·ft read in N·m comes back as 48.400000000000006.
    const topNm = 48.4 * LBF_FT_NM_EXACT;
    expect(convertTorque(topNm, 'n-m', 'lbf-ft')).toBeGreaterThan(48.4);
    expect(
      judgeTorque({ value: topNm, unit: 'n-m' }, spec(44, 'lbf-ft', 'percent', 10)).verdict,
    ).toBe('in-spec');
    expect(
      judgeTorque({ value: topNm + 0.01, unit: 'n-m' }, spec(44, 'lbf-ft', 'percent', 10)).verdict,
    ).toBe('over');
  });

  it('gives only a slack far below any wrench resolution', () => {
    expect(EDGE_EPSILON).toBe(1e-9);
    const s = spec(100, 'lbf-ft', 'value', 5);
    // 1e-6 lbf·ft past the edge is 10 000 times the slack: out.
    expect(judgeTorque({ value: 105.000001, unit: 'lbf-ft' }, s).verdict).toBe('over');
    expect(judgeTorque({ value: 94.999999, unit: 'lbf-ft' }, s).verdict).toBe('under');
  });
});
