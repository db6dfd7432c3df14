import { describe, expect, it } from 'vitest';
import {
  bestRun,
  convertBasis,
  correctRun,
  correctRunFor,
  correctionFactor,
  effectiveWeather,
  impliedDrivetrainLoss,
  progressTowardTarget,
  runPeaks,
  sortCurve,
  versusSupported,
  type DynoRunData,
  type RunForComparison,
} from '@shared/dyno';
import { correctedRunSchema, correctionResultSchema, type Weather } from '@shared/schemas/dyno';

function expectRel(actual: number, expected: number, rel: number) {
  expect(Math.abs(actual - expected), `${actual} vs ${expected}`).toBeLessThanOrEqual(
    rel * Math.abs(expected),
  );
}

const day30at97: Weather = {
  temperature: 30,
  temperatureUnit: 'c',
  pressure: 97,
  pressureUnit: 'kpa',
};

const units = { powerUnit: 'hp', torqueUnit: 'lbf-ft', boostUnit: 'psi' } as const;

const curve = [
  { rpm: 3000, power: 480, torque: null, boost: 38, egt: 690, mixture: 19.5 },
  { rpm: 2000, power: null, torque: 1000, boost: 30, egt: 610, mixture: 21 },
  { rpm: 2500, power: 470, torque: 990, boost: 35, egt: 650, mixture: 20 },
];

describe('applying a correction to a run', () => {
  it('multiplies peaks and the whole curve by the factor; rpm does not move', () => {
    // reference.md J1349 check (30 °C, 97 kPa dry) → 1.0343913.
    const run: DynoRunData = {
      ...units,
      peakPower: 500,
      peakPowerRpm: 2900,
      peakTorque: 1000,
      peakTorqueRpm: 2000,
      curve,
    };
    const c = correctionFactor({ standard: 'sae-j1349', weather: day30at97 });
    const r = correctRun(run, c, 'wheel');
    expectRel(r.corrected.power!, 500 * 1.0343913, 1e-6);
    expectRel(r.corrected.torque!, 1000 * 1.0343913, 1e-6);
    expect(r.measured).toMatchObject({ power: 500, powerRpm: 2900, powerSource: 'entered' });
    expect(r.corrected.powerRpm).toBe(2900);
    expect(r.peakPower?.label).toBe('Corrected peak power');
    expect(r.peakPower?.working.formula).toBe('P_corrected = CF × P_measured');
    expect(r.curve.map((x) => x.rpm)).toEqual([2000, 2500, 3000]);
    expectRel(r.curve[1].power, 470 * 1.0343913, 1e-6);
    expectRel(r.curve[1].torque, 990 * 1.0343913, 1e-6);
    // The 2000 rpm row had torque only: power = 1000 × 2000 / 5252.1131 hp (reference.md), then × CF.
    expectRel(r.curve[0].power, ((1000 * 2000) / 5252.113122) * 1.0343913, 1e-6);
    expect(r.curve[0].computed).toBe('power');
    // Boost, EGT and mixture are not corrected.
    expect(r.curve[2]).toMatchObject({ boost: 38, egt: 690, mixture: 19.5 });
  });

  it('takes peaks from the curve when none were typed in', () => {
    const run: DynoRunData = { ...units, curve };
    const peaks = runPeaks(run);
    expect(peaks).toMatchObject({ power: 480, powerRpm: 3000, powerSource: 'curve' });
    expect(peaks).toMatchObject({ torque: 1000, torqueRpm: 2000, torqueSource: 'curve' });
    expect(runPeaks({ ...units })).toMatchObject({ power: null, powerSource: 'none' });
  });

  it('uses the run’s weather, else the session’s, else none (factor 1, not applied)', () => {
    const hot: Weather = { ...day30at97, temperature: 35, pressure: 95 };
    expect(effectiveWeather({ weather: hot }, { weather: day30at97 })).toBe(hot);
    expect(effectiveWeather({ weather: null }, { weather: day30at97 })).toBe(day30at97);
    expect(effectiveWeather({}, null)).toBeNull();

    const run: DynoRunData = { ...units, peakPower: 500, peakPowerRpm: 3000 };
    // reference.md J1349 checks: (30, 97) → 1.0343913; (35, 95) → 1.0701463.
    const fromSession = correctRunFor(
      run,
      { standard: 'sae-j1349' },
      { dynoKind: 'chassis', sessionWeather: day30at97 },
    );
    expectRel(fromSession.correction.factor, 1.0343913, 1e-6);
    expect(fromSession.basis).toBe('wheel');
    const own = correctRunFor(
      { ...run, weather: hot },
      { standard: 'sae-j1349' },
      { dynoKind: 'engine', sessionWeather: day30at97 },
    );
    expectRel(own.correction.factor, 1.0701463, 1e-6);
    expect(own.basis).toBe('crank');
    const none = correctRunFor(run, { standard: 'sae-j1349' }, { dynoKind: 'chassis' });
    expect(none.correction.applied).toBe(false);
    expect(none.corrected.power).toBe(500);
    expect(none.peakPower?.label).toBe('Measured peak power');
  });

  it('R85 on a chassis run computes f_m from the run, the build and the assumptions', () => {
    // By hand: 153 wheel kW ÷ (1 − 15 %) = 180 crank kW; × 200 g/kWh ÷ 3600 = 10 g/s;
    // q = 120000 × 10 / (6 L × 2000 rpm) = 100; r = (97 + 97) / 97 = 2; q_c = 50; f_m = 0.66.
    // reference.md R85 at 30 °C, 97 kPa, turbo, f_m 0.66 → 1.0262402.
    const run: DynoRunData = {
      powerUnit: 'kw',
      torqueUnit: 'n-m',
      boostUnit: 'kpa',
      peakPower: 153,
      peakPowerRpm: 2000,
      boost: 97,
    };
    const r = correctRunFor(
      run,
      { standard: 'ece-r85' },
      {
        dynoKind: 'chassis',
        sessionWeather: day30at97,
        engine: {
          aspiration: 'turbocharged',
          displacementL: 6,
          bsfc: 200,
          bsfcUnit: 'g-per-kwh',
          drivetrainLossPct: 15,
        },
      },
    );
    expect(r.correction.engineFactor).toMatchObject({ source: 'computed' });
    // The result is what the API will send: it passes its own schema.
    expect(correctedRunSchema.safeParse(r).success).toBe(true);
    expect(correctionResultSchema.safeParse(r.correction).success).toBe(true);
    expectRel(r.correction.engineFactor!.qc!, 50, 1e-12);
    expectRel(r.correction.factor, 1.0262402, 1e-6);
    expectRel(r.corrected.power!, 153 * 1.0262402, 1e-6);
  });
});

describe('sorting', () => {
  it('sorts by rpm and keeps rows at the same rpm in their order', () => {
    const rows = [
      { rpm: 3000, tag: 'a' },
      { rpm: 2000, tag: 'b' },
      { rpm: 3000, tag: 'c' },
      { rpm: 1000, tag: 'd' },
    ];
    expect(sortCurve(rows).map((r) => r.tag)).toEqual(['d', 'b', 'a', 'c']);
    expect(rows[0].tag).toBe('a'); // not sorted in place
  });
});

describe('wheel and crank', () => {
  it('wheel = crank × (1 − loss), crank = wheel ÷ (1 − loss), and says so', () => {
    // By hand: 500 × (1 − 0.18) = 410; 410 ÷ 0.82 = 500.
    const wheel = convertBasis({ value: 500, unit: 'hp', basis: 'crank' }, 'wheel', 18);
    expectRel(wheel.value, 410, 1e-12);
    expect(wheel.working.formula).toContain('wheel = crank × (1 − loss)');
    expect(wheel.working.inputs.map((i) => i.name)).toContain('Drivetrain loss');
    const crank = convertBasis({ value: 410, unit: 'hp', basis: 'wheel' }, 'crank', 18);
    expectRel(crank.value, 500, 1e-12);
    expect(convertBasis({ value: 410, unit: 'hp', basis: 'wheel' }, 'wheel', 18).value).toBe(410);
    expect(() => convertBasis({ value: 410, unit: 'hp', basis: 'wheel' }, 'crank', 100)).toThrow(
      RangeError,
    );
  });

  it('the loss implied by a crank and a wheel figure is 1 − wheel ÷ crank', () => {
    // By hand: 1 − 410/500 = 18 %.
    const same = impliedDrivetrainLoss({ value: 500, unit: 'hp' }, { value: 410, unit: 'hp' });
    expectRel(same.loss.value, 18, 1e-12);
    expect(same.message).toBeNull();
    // 500 hp = 372.849936 kW (hp = 745.69987158227 W, NIST SP 811 (2008) B.9).
    const mixed = impliedDrivetrainLoss(
      { value: 372.849936, unit: 'kw' },
      { value: 410, unit: 'hp' },
    );
    expectRel(mixed.loss.value, 18, 1e-6);
    const odd = impliedDrivetrainLoss({ value: 400, unit: 'hp' }, { value: 420, unit: 'hp' });
    expect(odd.loss.value).toBeLessThan(0);
    expect(odd.message).toMatch(/cannot both be right/);
  });
});

describe('comparisons', () => {
  const corrected = (peakPower: number | null, powerUnit: 'hp' | 'kw' = 'hp') =>
    correctRun(
      {
        powerUnit,
        torqueUnit: 'lbf-ft',
        boostUnit: 'psi',
        peakPower,
        peakPowerRpm: peakPower && 3000,
      },
      correctionFactor({ standard: 'uncorrected', weather: null }),
      'wheel',
    );

  it('best run: the complete run with the highest corrected peak power, across units', () => {
    // 300 kW = 402.31 hp (hp = 745.69987 W, NIST SP 811 (2008) B.9) beats 400 hp; the
    // stopped 600 hp run and the run without a peak are passed over.
    const runs: RunForComparison[] = [
      { id: 'a', status: 'complete', corrected: corrected(400) },
      { id: 'b', status: 'complete', corrected: corrected(300, 'kw') },
      { id: 'c', status: 'aborted', corrected: corrected(600) },
      { id: 'd', status: 'complete', corrected: corrected(null) },
    ];
    const best = bestRun(runs)!;
    expect(best.id).toBe('b');
    expectRel(best.peakPowerHp, 300_000 / 745.69987158227, 1e-12);
    expect(bestRun([runs[2], runs[3]])).toBeNull();
    // A tie keeps the earlier run.
    expect(bestRun([runs[0], { ...runs[0], id: 'e' }])!.id).toBe('a');
  });

  it('progress toward the target, in the target’s basis', () => {
    // By hand: 410 wheel hp ÷ (1 − 18 %) = 500 crank hp = 100 % of a 500 crank hp target.
    const p = progressTowardTarget(
      { value: 410, unit: 'hp', basis: 'wheel' },
      { powerHp: 500, basis: 'crank' },
      18,
    );
    expectRel(p.progressPct.value, 100, 1e-12);
    expectRel(p.achieved.value, 500, 1e-12);
    expect(p.reached).toBe(true);
    // Same basis: 410 ÷ 500 = 82 %; 90 hp to go. No loss needed.
    const q = progressTowardTarget(
      { value: 410, unit: 'hp', basis: 'wheel' },
      { powerHp: 500, basis: 'wheel' },
    );
    expectRel(q.progressPct.value, 82, 1e-12);
    expectRel(q.remainingHp, 90, 1e-12);
    expect(q.reached).toBe(false);
    expect(() =>
      progressTowardTarget(
        { value: 410, unit: 'hp', basis: 'wheel' },
        { powerHp: 500, basis: 'crank' },
      ),
    ).toThrow(/drivetrainLossPct/);
  });

  it('against the most the build supports (the estimator’s figure)', () => {
    // By hand: 450 ÷ 600 = 75 %, 150 hp of margin.
    const v = versusSupported(
      { value: 450, unit: 'hp', basis: 'crank' },
      { powerHp: 600, basis: 'crank' },
    );
    expectRel(v.pctOfSupported.value, 75, 1e-12);
    expectRel(v.marginHp, 150, 1e-12);
    expect(v.beyondSupported).toBe(false);
    // 500 kW = 670.5 hp (NIST SP 811 (2008) B.9), beyond 600 hp.
    const w = versusSupported(
      { value: 500, unit: 'kw', basis: 'crank' },
      { powerHp: 600, basis: 'crank' },
    );
    expectRel(w.achieved.value, 500_000 / 745.69987158227, 1e-12);
    expect(w.beyondSupported).toBe(true);
    expect(w.achieved.working.steps[0].label).toBe('In hp');
  });
});
