import { describe, expect, it } from 'vitest';
import {
  buildReport,
  sessionReport,
  withCurveBoost,
  withoutCurves,
  type ReportRunInput,
} from '@shared/dyno';
import type { DynoPlan, Weather } from '@shared/schemas/dyno';

function expectRel(actual: number, expected: number, rel = 1e-9) {
  expect(Math.abs(actual - expected), `${actual} vs ${expected}`).toBeLessThanOrEqual(
    rel * Math.abs(expected),
  );
}

// reference.md, "Dynamometer correction": SAE J1349 at 30 °C and 97 kPa dry air → 1.0343913.
const J1349_30_97 = 1.0343913;
const weather: Weather = {
  temperature: 30,
  temperatureUnit: 'c',
  pressure: 97,
  pressureUnit: 'kpa',
};

const plan = (over: Partial<DynoPlan> = {}): DynoPlan => ({
  target: { powerHp: 600, basis: 'wheel', torqueLbft: 1200 },
  supported: { crankPowerHp: 750, wheelPowerHp: 750 * 0.8, limitedBy: 'Stock bottom end' },
  drivetrainLossPct: 20,
  engine: {
    aspiration: 'turbocharged',
    displacementL: 6.6,
    bsfc: 0.4,
    bsfcUnit: 'lb-per-hp-h',
    drivetrainLossPct: 20,
  },
  ...over,
});

const run = (
  id: string,
  peakPower: number,
  over: Partial<ReportRunInput> = {},
): ReportRunInput => ({
  id,
  status: 'complete',
  powerUnit: 'hp',
  torqueUnit: 'lbf-ft',
  boostUnit: 'psi',
  peakPower,
  peakPowerRpm: 3000,
  ...over,
});

describe('a session read against the plan', () => {
  it('takes the best complete run, passes over a stopped one, and compares it in the target’s basis', () => {
    const r = sessionReport(
      { dynoKind: 'chassis', weather },
      [
        run('a', 540),
        run('b', 575),
        run('c', 620, { status: 'aborted' }),
        run('d', 575), // a tie: the earlier run stays best
      ],
      { standard: 'sae-j1349' },
      plan(),
    );
    expect(r.basis).toBe('wheel');
    expect(r.best?.id).toBe('b');
    expectRel(r.best!.peakPowerHp, 575 * J1349_30_97, 1e-7);
    // Same basis as the target: no drivetrain loss involved.
    expectRel(r.vsTarget!.progressPct.value, ((575 * J1349_30_97) / 600) * 100, 1e-7);
    expect(r.vsTarget!.reached).toBe(false);
    // Against the wheel power the rated parts support: 750 × (1 − 0.20) = 600.
    expectRel(r.vsSupported!.pctOfSupported.value, ((575 * J1349_30_97) / 600) * 100, 1e-7);
    expect(r.targetPower.value).toBe(600);
    // The torque target is a crank figure; at the wheels it loses the same 20 %.
    expectRel(r.targetTorque!.value, 1200 * 0.8);
  });

  it('moves the target to the crank for an engine dyno, with the drivetrain loss in its working', () => {
    const r = sessionReport(
      { dynoKind: 'engine', weather: null },
      [run('a', 700)],
      { standard: 'uncorrected' },
      plan(),
    );
    expect(r.basis).toBe('crank');
    expectRel(r.targetPower.value, 600 / 0.8);
    expect(r.targetPower.working.inputs.map((i) => i.name)).toContain('Drivetrain loss');
    expect(r.targetTorque!.value).toBe(1200);
    // 700 crank hp at 20 % loss is 560 wheel hp against the 600 wheel hp target.
    expectRel(r.vsTarget!.achieved.value, 560);
  });

  it('has no best, progress or comparison before a complete run, and none against an unrated build', () => {
    const r = sessionReport(
      { dynoKind: 'chassis', weather },
      [run('a', 400, { status: 'aborted' })],
      { standard: 'sae-j1349' },
      plan({ supported: null }),
    );
    expect(r.best).toBeNull();
    expect(r.vsTarget).toBeNull();
    expect(r.vsSupported).toBeNull();
  });

  it('reads R85’s boost at peak power from the curve when none was typed in', () => {
    const curve = [
      { rpm: 2500, power: 450, torque: null, boost: 30, egt: null, mixture: null },
      { rpm: 3000, power: 500, torque: null, boost: 35, egt: null, mixture: null },
    ];
    const r = run('a', 0, { peakPower: null, peakPowerRpm: null, curve });
    expect(withCurveBoost(r).boost).toBe(35);
    expect(withCurveBoost({ ...r, boost: 20 }).boost).toBe(20);
    const report = sessionReport(
      { dynoKind: 'engine', weather },
      [r],
      { standard: 'ece-r85' },
      plan(),
    );
    expect(report.runs[0].corrected.correction.engineFactor?.source).toBe('computed');
    // Curves can be left out of a summary without touching the figures.
    const slim = withoutCurves(report);
    expect(slim.runs[0].corrected.curve).toEqual([]);
    expect(slim.runs[0].corrected.corrected).toEqual(report.runs[0].corrected.corrected);
  });
});

describe('a build’s dyno results', () => {
  it('picks the best result in the target’s basis across kinds of dyno, and the loss a crank and a wheel figure imply', () => {
    const result = buildReport(
      [
        { id: 's1', date: '2026-10-01', dynoKind: 'engine', weather: null, runs: [run('e1', 700)] },
        {
          id: 's2',
          date: '2026-10-08',
          dynoKind: 'chassis',
          weather: null,
          runs: [run('c1', 570, { runNumber: 1 }), run('c2', 582, { runNumber: 2 })],
        },
      ],
      { standard: 'uncorrected' },
      plan(),
    );
    const { report } = result;
    // 582 wheel hp beats 700 crank hp = 560 wheel hp at the assumed 20 % loss.
    expect(report.best).toMatchObject({ id: 'c2', sessionId: 's2', runNumber: 2, basis: 'wheel' });
    expectRel(report.vsTarget!.progressPct.value, (582 / 600) * 100);
    expect(report.bestCrank?.id).toBe('e1');
    expect(report.bestWheel?.id).toBe('c2');
    // loss = 1 − wheel ÷ crank = 1 − 582/700.
    expectRel(report.impliedLoss!.loss.value, (1 - 582 / 700) * 100);
    expect(report.impliedLoss!.message).toBeNull();
    expect(result.sessions.map((s) => s.id)).toEqual(['s1', 's2']);
  });

  it('has nothing to report before the first complete run', () => {
    const { report } = buildReport([], { standard: 'sae-j1349' }, plan());
    expect(report).toMatchObject({ best: null, vsTarget: null, impliedLoss: null });
  });
});
