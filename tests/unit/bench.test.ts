import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import * as ss from 'simple-statistics';
import {
  MAKER_RETURN_LIMIT_RULE,
  WORN_INJECTOR_RULE,
  analyseBenchSheet,
  benchStatistics,
  compareBenchSheets,
  convertBenchValue,
  defaultTestPoints,
  defaultToleranceFor,
  fromMm3PerStroke,
  imbalanceCost,
  imbalanceCostRecovered,
  median,
  testPointPreset,
  toMm3PerStroke,
  type BenchPointInput,
} from '@shared/bench';
import {
  benchComparisonSchema,
  benchSheetResultSchema,
  createBenchSheetInputSchema,
  imbalanceRecoverySchema,
  type TestPoint,
} from '@shared/schemas/bench';
import { convertPressure } from '@shared/units';

function expectRel(actual: number | null, expected: number, rel: number) {
  expect(actual).not.toBeNull();
  expect(Math.abs(actual! - expected), `${actual} vs ${expected}`).toBeLessThanOrEqual(
    rel * Math.abs(expected),
  );
}

/** A test point with the given values; tolerance and unit as a kind's usual. */
function point(
  kind: TestPoint['kind'],
  values: (number | null)[],
  extra: Partial<BenchPointInput> = {},
): BenchPointInput {
  const preset = testPointPreset(kind);
  return {
    kind,
    label: preset.label,
    unit: preset.unit,
    tolerance: preset.tolerance,
    values,
    ...extra,
  };
}

const REFERENCE_SIX = [100, 102, 98, 101, 99, 100];
const REFERENCE_EIGHT = [52.0, 53.5, 51.2, 52.8, 50.9, 52.6, 53.1, 51.9];

describe('flow-bench statistics', () => {
  it('reference.md worked set [100, 102, 98, 101, 99, 100]', () => {
    // reference.md, "Flow-bench statistics"
    const s = benchStatistics(REFERENCE_SIX);
    expect(s.n).toBe(6);
    expect(s.missing).toBe(0);
    expect(s.mean).toBeCloseTo(100, 12);
    expect(s.populationSd).toBeCloseTo(1.2909944, 7);
    expect(s.sampleSd).toBeCloseTo(1.4142136, 7);
    expect(s.maxDeviationPct).toBeCloseTo(2, 12);
    expect(s.spreadPct).toBeCloseTo(4, 12);
    // reference.md's CV = s/x̄ with the sample SD it prints: 1.4142136 / 100
    expect(s.cvPct).toBeCloseTo(1.4142136, 7);
    expect(s.min).toBe(98);
    expect(s.max).toBe(102);
  });

  it('reference.md worked set of eight injectors', () => {
    // reference.md, "Flow-bench statistics"
    const s = benchStatistics(REFERENCE_EIGHT);
    expect(s.mean).toBeCloseTo(52.25, 12);
    expect(s.sampleSd).toBeCloseTo(0.9118271, 7);
    expect(s.cvPct).toBeCloseTo(1.745124, 6);
    expect(s.maxDeviationPct).toBeCloseTo(2.583732, 6);
    expect(s.spreadPct).toBeCloseTo(4.976077, 6);
  });

  it('NIST StRD NumAcc1: mean 10000002, sample SD exactly 1', () => {
    // NIST Statistical Reference Datasets, NumAcc1 (certified values), as in reference.md
    const s = benchStatistics([10000001, 10000003, 10000002]);
    expect(s.mean).toBe(10000002);
    expect(s.sampleSd).toBe(1);
  });

  it('stays accurate on large values with a small spread (the shape of NIST StRD NumAcc4)', () => {
    // Built like NumAcc4 (from memory): 10000000.2 then 500 pairs of 10000000.1 and 10000000.3.
    // By hand: mean 10000000.2; deviations 0 and ±0.1 × 1000, Σd² = 10, sample SD √(10/1000) = 0.1.
    const values = [10000000.2];
    for (let i = 0; i < 500; i++) values.push(10000000.1, 10000000.3);
    const s = benchStatistics(values);
    expect(s.mean).toBeCloseTo(10000000.2, 6);
    expectRel(s.sampleSd, 0.1, 1e-6);
  });

  it('counts a missing value as missing, never as zero', () => {
    // By hand: the three values present average 100; with a zero the mean would be 75.
    const s = benchStatistics([100, null, 100, 100]);
    expect(s.n).toBe(3);
    expect(s.missing).toBe(1);
    expect(s.mean).toBe(100);
    expect(s.spreadPct).toBe(0);
  });

  it('leaves the sample SD and CV empty below two values, and every figure empty with none', () => {
    expect(benchStatistics([52]).sampleSd).toBeNull();
    expect(benchStatistics([52]).cvPct).toBeNull();
    expect(benchStatistics([52]).populationSd).toBe(0);
    const none = benchStatistics([null, null]);
    expect(none).toMatchObject({ n: 0, missing: 2, mean: null, spreadPct: null });
  });

  it('gives no percentage of a zero mean', () => {
    const s = benchStatistics([0, 0, 0]);
    expect(s.mean).toBe(0);
    expect(s.cvPct).toBeNull();
    expect(s.spreadPct).toBeNull();
  });

  it('refuses a value that is not finite', () => {
    expect(() => benchStatistics([1, Number.NaN])).toThrow(RangeError);
  });

  it('agrees with simple-statistics on random sets with gaps', () => {
    // simple-statistics 7 (independent library): mean, sampleStandardDeviation,
    // standardDeviation (population form), min, max.
    fc.assert(
      fc.property(
        fc.array(
          fc.option(fc.double({ min: 0.5, max: 500, noNaN: true }), { freq: 5, nil: null }),
          { minLength: 2, maxLength: 16 },
        ),
        (raw) => {
          const xs = raw.filter((v): v is number => v !== null);
          fc.pre(xs.length >= 2);
          const s = benchStatistics(raw);
          const mean = ss.mean(xs);
          const max = ss.max(xs);
          const min = ss.min(xs);
          expect(s.n).toBe(xs.length);
          expect(s.missing).toBe(raw.length - xs.length);
          expectRel(s.mean, mean, 1e-12);
          const scale = max; // SDs are compared against the size of the values
          expect(Math.abs(s.sampleSd! - ss.sampleStandardDeviation(xs))).toBeLessThanOrEqual(
            1e-9 * scale,
          );
          expect(Math.abs(s.populationSd! - ss.standardDeviation(xs))).toBeLessThanOrEqual(
            1e-9 * scale,
          );
          const maxDev = (100 * Math.max(max - mean, mean - min)) / mean;
          expect(Math.abs(s.maxDeviationPct! - maxDev)).toBeLessThanOrEqual(1e-9 * (1 + maxDev));
          if (max === min) expect(s.spreadPct).toBe(0);
          else expectRel(s.spreadPct, (100 * (max - min)) / mean, 1e-9);
        },
      ),
      { numRuns: 300 },
    );
  });

  it('takes the median of an odd and an even count', () => {
    // By hand
    expect(median([3, 1, 2])).toBe(2);
    expect(median([4, 1, 3, 2])).toBe(2.5);
    expect(median([])).toBeNull();
  });
});

describe('bench units', () => {
  it('psi, bar and MPa as NIST SP 811 defines them', () => {
    // NIST SP 811 (2008) B.9 prints psi → kPa 6.894757 (seven significant digits)
    expect(Math.abs(convertPressure(1, 'psi', 'kpa') - 6.894757)).toBeLessThanOrEqual(5e-7);
    // bar = 100 kPa exactly (NIST SP 811 (2008) B.8); MPa = 1000 kPa (SI prefix)
    expect(convertPressure(1, 'bar', 'kpa')).toBe(100);
    expect(convertPressure(1, 'mpa', 'kpa')).toBe(1000);
    expect(convertBenchValue(1600, { unit: 'bar' }, { unit: 'mpa' })).toBe(160);
    // 1 bar in psi = 100 kPa ÷ 6.894757293168361 kPa/psi (reference.md's psi factor) = 14.5037738
    expect(convertBenchValue(1, { unit: 'bar' }, { unit: 'psi' })).toBeCloseTo(14.5037738, 7);
  });

  it('1 ml per 1000 strokes is 1 mm³/stroke by definition', () => {
    // ml = cm³ = 1000 mm³ (SI; NIST SP 811 (2008) B.8, litre = dm³)
    expect(toMm3PerStroke(1, 'ml-per-1000-strokes')).toBe(1);
    expect(toMm3PerStroke(52.1, 'ml-per-1000-strokes')).toBe(52.1);
    expect(fromMm3PerStroke(52.1, 'ml-per-1000-strokes')).toBe(52.1);
  });

  it('ml/min needs its stroke rate: mm³/stroke = ml/min × 1000 ÷ strokes/min', () => {
    // By hand: 26.05 ml/min at 500 strokes/min = 0.0521 ml = 52.1 mm³ a stroke
    expect(toMm3PerStroke(26.05, 'ml-per-min', 500)).toBeCloseTo(52.1, 12);
    expect(fromMm3PerStroke(52.1, 'ml-per-min', 500)).toBeCloseTo(26.05, 12);
    expect(toMm3PerStroke(26.05, 'ml-per-min')).toBeNull();
    expect(
      convertBenchValue(
        26.05,
        { unit: 'ml-per-min', strokesPerMin: 500 },
        { unit: 'mm3-per-stroke' },
      ),
    ).toBeCloseTo(52.1, 12);
    // By hand: 52.1 ml/min at 1000 strokes/min = 52.1 mm³/stroke = 26.05 ml/min at 500 strokes/min
    expect(
      convertBenchValue(
        52.1,
        { unit: 'ml-per-min', strokesPerMin: 1000 },
        { unit: 'ml-per-min', strokesPerMin: 500 },
      ),
    ).toBeCloseTo(26.05, 12);
  });

  it('cannot turn a flow into a pressure', () => {
    expect(convertBenchValue(1, { unit: 'mm3-per-stroke' }, { unit: 'bar' })).toBeNull();
  });

  it('restates an absolute default tolerance in the point’s unit', () => {
    // 10 bar = 1 MPa (NIST SP 811 (2008) B.8 bar = 100 kPa)
    expect(defaultToleranceFor('opening-pressure', { unit: 'mpa' })?.value).toBe(1);
    // By hand: 0.5 mm³/stroke at 1000 strokes/min = 0.5 ml/min
    expect(
      defaultToleranceFor('idle', { unit: 'ml-per-min', strokesPerMin: 1000 })?.value,
    ).toBeCloseTo(0.5, 12);
    expect(defaultToleranceFor('idle', { unit: 'ml-per-min' })).toBeNull();
  });
});

describe('default test points', () => {
  it('start with the common-rail plan and Headroom’s default tolerances', () => {
    const points = defaultTestPoints();
    expect(points.map((p) => p.kind)).toEqual([
      'full-load',
      'part-load',
      'idle',
      'pilot',
      'return-flow',
    ]);
    // common practice: a matched set within about 1 % of the mean at full load (reference.md)
    expect(points[0]!.tolerance).toEqual({ type: 'percent', value: 1 });
    // common practice (Headroom's defaults): idle ±0.5, pilot ±0.3 mm³/stroke
    expect(points[2]!.tolerance).toEqual({ type: 'absolute', value: 0.5 });
    expect(points[3]!.tolerance).toEqual({ type: 'absolute', value: 0.3 });
    // common practice: opening pressure ±10 bar
    expect(testPointPreset('opening-pressure')).toMatchObject({
      unit: 'bar',
      tolerance: { type: 'absolute', value: 10 },
    });
  });

  it('are fresh objects each time and make a valid sheet', () => {
    const a = defaultTestPoints();
    a[0]!.values.push(1);
    expect(defaultTestPoints()[0]!.values).toEqual([]);
    const sheet = {
      partId: '6f1c1f0e-8a4b-4c55-9d7e-2f0a1b2c3d4e',
      occasion: 'as received',
      testedOn: '2026-03-01',
      points: defaultTestPoints([
        'full-load',
        'part-load',
        'idle',
        'pilot',
        'return-flow',
        'opening-pressure',
        'custom',
      ]),
    };
    expect(createBenchSheetInputSchema.safeParse(sheet).success).toBe(true);
  });
});

describe('verdicts against the tolerance', () => {
  it('a value exactly on the tolerance edge is in tolerance', () => {
    // By hand: mean of 99 and 101 is 100; ±1 % is 99…101
    const r = analyseBenchSheet({ points: [point('full-load', [99, 101])] });
    expect(r.points[0]!.injectors.map((i) => i.vsMean)).toEqual(['in', 'in']);
    // By hand: mean 30, ±1 % is 29.7…30.3, edges that floating point cannot hold exactly
    const f = analyseBenchSheet({ points: [point('full-load', [29.7, 30.3])] });
    expect(f.points[0]!.injectors.map((i) => i.status)).toEqual(['in-tolerance', 'in-tolerance']);
    // By hand: 310 ± 10 bar reaches 320 exactly
    const op = analyseBenchSheet({
      points: [point('opening-pressure', [300, 320], { nominal: 310 })],
    });
    expect(op.points[0]!.injectors.map((i) => i.vsNominal)).toEqual(['in', 'in']);
  });

  it('flags an injector just outside ±1 % of the set mean', () => {
    // By hand: [98.9, 101.1, 100] averages 100; 98.9 is −1.1 %, 101.1 is +1.1 %
    const r = analyseBenchSheet({ points: [point('full-load', [98.9, 101.1, 100])] });
    const [a, b, c] = r.points[0]!.injectors;
    expect(a!.vsMean).toBe('low');
    expect(b!.vsMean).toBe('high');
    expect(c!.vsMean).toBe('in');
    expect(a!.deviationPct).toBeCloseTo(-1.1, 10);
    expect(r.points[0]!.flaggedPositions).toEqual([1, 2]);
    expect(r.status).toBe('out-of-tolerance');
    expect(r.verdict).toBe(
      'Injector 1 is low at full load (−1.1 %); injector 2 is high at full load (+1.1 %)',
    );
  });

  it('says a matched set is matched, with its largest deviation rounded for reading', () => {
    // By hand: mean 100, largest deviation 0.6 %
    const r = analyseBenchSheet({
      points: [point('full-load', [100, 100.6, 99.4, 100.2, 99.8, 100])],
    });
    expect(r.status).toBe('in-tolerance');
    expect(r.verdict).toBe('Matched within ±0.6 % at full load');
    expect(r.points[0]!.statistics.maxDeviationPct).toBeCloseTo(0.6, 10);
  });

  it('judges idle by an absolute tolerance in mm³/stroke', () => {
    // By hand: mean (6.0 + 6.2 + 5.4 + 6.1) / 4 = 5.925; 5.4 is 0.525 below (> 0.5), 6.2 is 0.275 above
    const r = analyseBenchSheet({ points: [point('idle', [6.0, 6.2, 5.4, 6.1])] });
    const inj = r.points[0]!.injectors;
    expect(inj[2]!.vsMean).toBe('low');
    expect(inj[2]!.deviation).toBeCloseTo(-0.525, 12);
    expect(inj[1]!.vsMean).toBe('in');
    expect(r.verdict).toBe('Injector 3 is low at idle (−0.525 mm³/stroke)');
  });

  it('fails a set matched to itself but low against the maker’s figure', () => {
    // By hand: mean 50 against a nominal of 53: 50/53 − 1 = −5.66 %, every injector below 53 − 1 %
    const r = analyseBenchSheet({
      points: [point('full-load', [50, 50.2, 49.9, 50.1, 49.8, 50], { nominal: 53 })],
    });
    expect(r.points[0]!.injectors.every((i) => i.vsMean === 'in')).toBe(true);
    expect(r.points[0]!.injectors.every((i) => i.vsNominal === 'low')).toBe(true);
    expect(r.status).toBe('out-of-tolerance');
    expect(r.findings[0]!.kind).toBe('set-below-nominal');
    expect(r.verdict).toBe(
      "The whole set is low at full load against the maker's 53 mm³/stroke (mean −5.7 %)",
    );
  });

  it('judges opening pressure against its nominal', () => {
    // By hand: 321 bar is 11 bar over a 310 ± 10 bar nominal; within 10 bar of the set mean 311.75
    const r = analyseBenchSheet({
      points: [point('opening-pressure', [305, 312, 321, 309], { nominal: 310 })],
    });
    const third = r.points[0]!.injectors[2]!;
    expect(third.vsMean).toBe('in');
    expect(third.vsNominal).toBe('high');
    expect(third.nominalDeviation).toBe(11);
    expect(r.verdict).toBe("Injector 3 is above the maker's figure at opening pressure (+11 bar)");
  });

  it('says which injector was not measured and judges the rest', () => {
    const r = analyseBenchSheet({ points: [point('full-load', [100, null, 100.2, 99.8])] });
    expect(r.points[0]!.injectors[1]!.status).toBe('missing');
    expect(r.points[0]!.statistics.n).toBe(3);
    expect(r.verdict).toBe(
      'Matched within ±0.2 % at full load; injector 2 not measured at full load',
    );
  });

  it('has nothing to say about a sheet with no values', () => {
    const r = analyseBenchSheet(
      { points: defaultTestPoints() as BenchPointInput[] },
      { cylinders: 8 },
    );
    expect(r.status).toBe('no-values');
    expect(r.verdict).toBe('No values recorded yet');
  });

  it('refuses a value beyond the build’s cylinders', () => {
    expect(() =>
      analyseBenchSheet({ points: [point('full-load', [1, 2, 3])] }, { cylinders: 2 }),
    ).toThrow(RangeError);
  });
});

describe('worn injector rule (return flow)', () => {
  it('is exported in words for the page', () => {
    expect(WORN_INJECTOR_RULE).toContain('1.5 ×');
    expect(MAKER_RETURN_LIMIT_RULE).toContain("maker's limit");
  });

  it('flags one injector with twice the others’ return flow, even with its delivery in tolerance', () => {
    // common practice: a worn injector shows about twice the others' leak-off.
    // By hand: the others' median is 10 (7 values 9.8…10.2), injector 3 returns 20 = 2 × 10.
    const r = analyseBenchSheet({
      points: [
        point('full-load', [100, 100.2, 99.9, 100.1, 99.8, 100, 100.1, 99.9]),
        point('return-flow', [10, 10.2, 20, 9.9, 10.1, 10, 9.8, 10.1]),
      ],
    });
    const ret = r.points[1]!.injectors;
    expect(ret.filter((i) => i.returnFlow?.worn).map((i) => i.position)).toEqual([3]);
    expect(ret[2]!.returnFlow).toMatchObject({ othersMedian: 10, ratio: 2, excess: 10 });
    expect(r.points[0]!.injectors[2]!.status).toBe('in-tolerance');
    expect(r.verdict).toBe("Injector 3 is worn (return flow 2 × the others')");
  });

  it('does not call a uniformly high set one worn injector, but a maker’s limit catches it', () => {
    const values = [30, 31, 29, 30.5, 29.5, 30, 30, 31];
    const without = analyseBenchSheet({ points: [point('return-flow', values)] });
    expect(without.points[0]!.injectors.some((i) => i.returnFlow?.worn)).toBe(false);
    expect(without.status).toBe('in-tolerance');

    const withLimit = analyseBenchSheet({
      points: [point('return-flow', values, { returnLimit: 20 })],
    });
    const inj = withLimit.points[0]!.injectors;
    expect(inj.every((i) => i.flags.join() === 'over-limit')).toBe(true);
    expect(withLimit.findings.map((f) => f.kind)).toEqual(['set-over-limit']);
    expect(withLimit.verdict).toBe(
      "Every injector is over the maker's return flow limit of 20 mm³/stroke (highest 31)",
    );
  });

  it('does not flag exactly 1.5 × the others’ median', () => {
    // By hand: others' median 10, 1.5 × 10 = 15 is not "more than 1.5 ×"; 15.1 is
    const at = analyseBenchSheet({ points: [point('return-flow', [10, 10, 15, 10, 10, 10])] });
    expect(at.points[0]!.injectors[2]!.returnFlow!.worn).toBe(false);
    const over = analyseBenchSheet({ points: [point('return-flow', [10, 10, 15.1, 10, 10, 10])] });
    expect(over.points[0]!.injectors[2]!.returnFlow!.worn).toBe(true);
  });

  it('needs the excess over the median to be more than the point’s tolerance', () => {
    // By hand, tolerance ±2 mm³/stroke: 2.5 is 2.5 × a median of 1 but only 1.5 above it;
    // 4 is 2 × a median of 2 and exactly 2 above it (not more)
    const small = analyseBenchSheet({ points: [point('return-flow', [1, 1, 2.5, 1, 1])] });
    expect(small.points[0]!.injectors[2]!.returnFlow!.worn).toBe(false);
    const edge = analyseBenchSheet({ points: [point('return-flow', [2, 2, 4, 2, 2])] });
    expect(edge.points[0]!.injectors[2]!.returnFlow!.worn).toBe(false);
  });

  it('names one injector over the maker’s limit that is not worn', () => {
    // By hand: 11 is over a limit of 10.5 but only 1.1 × the others' median of 10
    const r = analyseBenchSheet({
      points: [point('return-flow', [10, 10, 11, 10, 10], { returnLimit: 10.5 })],
    });
    expect(r.points[0]!.injectors[2]!.flags).toEqual(['over-limit']);
    expect(r.verdict).toBe(
      "Injector 3 is over the maker's return flow limit (11 against 10.5 mm³/stroke)",
    );
  });

  it('puts a worn injector before a delivery problem in the verdict', () => {
    // By hand: reference.md's eight-injector set with every deviation but injector 5's cut to a
    // tenth: mean 52.098125, injector 5 at 50.9 is 2.3 % below it and the rest within 0.6 %
    const r = analyseBenchSheet({
      points: [
        point(
          'full-load',
          REFERENCE_EIGHT.map((v, i) => (i === 4 ? v : 52.25 + (v - 52.25) / 10)),
        ),
        point('return-flow', [10, 10.2, 21, 9.9, 10.1, 10, 9.8, 10.1]),
      ],
    });
    expect(
      r.verdict.startsWith(
        "Injector 3 is worn (return flow 2.1 × the others'); injector 5 is low at full load (−",
      ),
    ).toBe(true);
  });
});

describe('imbalance cost (rule of thumb, reference.md)', () => {
  const target = { powerHp: 700, basis: 'crank' as const };

  it('a set 2 % rich at its richest injector costs 14 hp of 700', () => {
    // rule of thumb, reference.md: cost ≈ richest excess over the mean as a share of peak power.
    // By hand: max 102, mean 100 → 2 %; 700 hp × 2 % = 14 hp.
    const r = imbalanceCost({ points: [point('full-load', REFERENCE_SIX)] }, target);
    expect(r.available).toBe(true);
    if (!r.available) return;
    expect(r.richestPosition).toBe(2);
    expect(r.sharePct.value).toBeCloseTo(2, 12);
    expect(r.power.value).toBeCloseTo(14, 10);
    expect(r.power.unit).toBe('hp-crank');
    expect(r.power.working.rule.status).toBe('rule of thumb');
    expect(r.power.working.steps.at(-1)!.value).toBeCloseTo(14, 10);
    expect(r.power.working.inputs.map((i) => i.value)).toEqual([700, expect.closeTo(2, 12)]);
    expect(r.summary).toBe(
      'Imbalance at full load costs about 14 hp of the 700 crank hp target (2 %, rule of thumb)',
    );
  });

  it('is about 2 % for a 4–5 % spread', () => {
    // rule of thumb, reference.md: "about 2 % for a 4–5 % spread"; reference.md's eight-injector
    // set has a spread of 4.976 % and its richest is (53.5 − 52.25)/52.25 = 2.39 % over the mean.
    const r = imbalanceCost({ points: [point('full-load', REFERENCE_EIGHT)] }, target);
    if (!r.available) throw new Error(r.reason);
    expect(r.sharePct.value).toBeCloseTo((100 * 1.25) / 52.25, 10);
    expect(r.sharePct.value).toBeGreaterThan(2);
    expect(r.sharePct.value).toBeLessThan(2.5);
  });

  it('gives the power a rebuild recovers', () => {
    // By hand: before 2 % → 14 hp; after [100, 100.4, 99.6, 100, 100, 100] 0.4 % → 2.8 hp; 11.2 hp back
    const before = { points: [point('full-load', REFERENCE_SIX)] };
    const after = { points: [point('full-load', [100, 100.4, 99.6, 100, 100, 100])] };
    const r = imbalanceCostRecovered(before, after, target);
    expect(r.recovered!.value).toBeCloseTo(11.2, 9);
    expect(r.recovered!.working.rule.status).toBe('rule of thumb');
    expect(r.summary).toBe(
      'The rebuild recovers about 11 hp at the 700 crank hp target (rule of thumb)',
    );
  });

  it('says why it cannot be estimated', () => {
    const none = imbalanceCost({ points: [point('idle', [6, 6])] }, target);
    expect(none).toEqual({ available: false, reason: 'The sheet has no full-load point' });
    const one = imbalanceCost({ points: [point('full-load', [52, null])] }, target);
    expect(one.available).toBe(false);
    expect(() => imbalanceCost({ points: [] }, { powerHp: 0, basis: 'crank' })).toThrow(RangeError);
  });
});

describe('two sheets compared', () => {
  it('gives each injector’s change and the change in CV and spread', () => {
    // By hand: injector 2 goes 102 → 100.5, −1.5 (−1.5/102 = −1.4705882 %); spread 4 % → 1 %;
    // after sample SD √((0.25 + 0.25 + 0.04 + 0.04)/5) = √0.116 = 0.3405877, so CV 1.4142136 → 0.3405877 %
    const before = { points: [point('full-load', REFERENCE_SIX)] };
    const after = { points: [point('full-load', [100, 100.5, 99.5, 100.2, 99.8, 100])] };
    const c = compareBenchSheets(before, after);
    const p = c.points[0]!;
    expect(p.injectors[1]!.change).toBeCloseTo(-1.5, 12);
    expect(p.injectors[1]!.changePct).toBeCloseTo(-1.4705882, 7);
    expect(p.spreadChange).toBeCloseTo(-3, 10);
    expect(p.after.cvPct).toBeCloseTo(0.3405877, 7);
    expect(p.cvChange).toBeCloseTo(0.3405877 - 1.4142136, 6); // both rounded to 7 places above
    expect(p.converted).toBe(false);
  });

  it('matches points by kind and label, case and spacing ignored, and restates units', () => {
    const before = {
      points: [
        point('full-load', [50, 52], { label: 'Full load' }),
        point('idle', [6, 6]),
        point('custom', [1, 1], { label: 'Rail', unit: 'bar' }),
      ],
    };
    const after = {
      points: [
        // 1 ml/1000 strokes = 1 mm³/stroke (definition)
        point('full-load', [51, 51], { label: '  full  LOAD ', unit: 'ml-per-1000-strokes' }),
        point('pilot', [1.5, 1.5]),
        point('custom', [1, 1], { label: 'rail', unit: 'mm3-per-stroke' }),
      ],
    };
    const c = compareBenchSheets(before, after);
    expect(c.points).toHaveLength(1);
    expect(c.points[0]!.converted).toBe(true);
    expect(c.points[0]!.injectors.map((i) => i.change)).toEqual([1, -1]);
    expect(c.onlyBefore).toEqual([{ kind: 'idle', label: 'Idle' }]);
    expect(c.onlyAfter).toEqual([{ kind: 'pilot', label: 'Pilot' }]);
    expect(c.notComparable).toEqual([
      {
        kind: 'custom',
        label: 'Rail',
        reason: 'One sheet records a flow and the other a pressure',
      },
    ]);
  });

  it('refuses sheets of two different parts', () => {
    expect(() =>
      compareBenchSheets({ partId: 'a', points: [] }, { partId: 'b', points: [] }),
    ).toThrow(RangeError);
  });
});

describe('results match their schemas', () => {
  it('a judged sheet, a comparison and an imbalance recovery parse as the API will send them', () => {
    const before = {
      points: [
        point('full-load', REFERENCE_EIGHT),
        point('idle', [6, 6.1, null, 5.9, 6, 6, 6.2, 5.8]),
        point('return-flow', [10, 10.2, 21, 9.9, 10.1, 10, 9.8, 10.1], { returnLimit: 15 }),
      ],
    };
    const after = {
      points: [point('full-load', [52.2, 52.3, 52.1, 52.2, 52.2, 52.3, 52.2, 52.1])],
    };
    const target = { powerHp: 650, basis: 'wheel' as const };
    expect(benchSheetResultSchema.safeParse(analyseBenchSheet(before)).success).toBe(true);
    expect(benchComparisonSchema.safeParse(compareBenchSheets(before, after)).success).toBe(true);
    expect(
      imbalanceRecoverySchema.safeParse(imbalanceCostRecovered(before, after, target)).success,
    ).toBe(true);
  });
});
