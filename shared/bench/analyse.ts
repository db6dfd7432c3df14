/**
 * Judges a flow-bench sheet: each point's statistics, each injector against
 * the point's tolerance around the set mean and around the maker's nominal,
 * return flow against the worn-injector rule and the maker's limit, and a set
 * verdict in plain words.
 *
 * How a point is judged (the judgement calls, stated once):
 * - Every point except return flow: each injector against the set mean ± the
 *   tolerance (percent of the mean, or an amount in the point's unit), needing
 *   at least two values; and, when the point has a nominal, against the
 *   nominal ± the same tolerance (percent of the nominal, or the amount). A set
 *   matched to itself but low overall therefore fails against the nominal.
 * - Return flow: the worn rule ({@link WORN_INJECTOR_RULE}) against the median
 *   of the other injectors (needing at least two others), and the maker's
 *   limit when given ({@link MAKER_RETURN_LIMIT_RULE}). A uniformly high set is
 *   not worn (nobody stands out) but every injector over the limit is flagged.
 * - A value exactly on a tolerance edge is in tolerance (BENCH_EDGE_EPSILON
 *   absorbs float error); exactly 1.5 × the others' median is not worn.
 * - A missing value is not judged and never counts as zero; the verdict says
 *   which injectors were not measured.
 */
import type {
  BandVerdict,
  BenchFinding,
  BenchSheetResult,
  FindingKind,
  InjectorFlag,
  InjectorResult,
  PointResult,
  PointStatus,
  ReturnFlowCheck,
  SheetStatus,
  TestPoint,
} from '@shared/schemas/bench';
import { BENCH_MAX_CYLINDERS } from './limits';
import { BENCH_EDGE_EPSILON, WORN_RETURN_FLOW_RATIO } from './points';
import { benchStatistics, median } from './statistics';
import { benchUnitLabels } from './units';
import {
  capitalise,
  injectorsWords,
  labelInSentence,
  pctWords,
  ratioWords,
  roundForWords,
  signedPctWords,
  signedValueWords,
  valueWords,
} from './words';

/** What a point needs to be judged: a test point as the schema gives it. */
export type BenchPointInput = Pick<TestPoint, 'kind' | 'label' | 'unit' | 'tolerance' | 'values'> &
  Partial<Pick<TestPoint, 'strokesPerMin' | 'condition' | 'nominal' | 'returnLimit'>>;

type Band = { low: number; high: number; slack: number };

function bandAround(ref: number, tolerance: TestPoint['tolerance']): Band {
  const half =
    tolerance.type === 'percent' ? (Math.abs(ref) * tolerance.value) / 100 : tolerance.value;
  return {
    low: ref - half,
    high: ref + half,
    slack: BENCH_EDGE_EPSILON * (Math.abs(ref) + half),
  };
}

function judge(value: number, band: Band | null): BandVerdict {
  if (!band) return 'not-judged';
  if (value < band.low - band.slack) return 'low';
  if (value > band.high + band.slack) return 'high';
  return 'in';
}

function pctDiff(value: number, ref: number): number | null {
  return ref === 0 ? null : (100 * (value - ref)) / ref;
}

/** The values at positions 1…cylinders, null where none was given. */
export function valuesByPosition(
  values: readonly (number | null)[],
  cylinders: number,
): (number | null)[] {
  for (let j = cylinders; j < values.length; j++) {
    if (values[j] != null) {
      throw new RangeError(
        `A value at position ${j + 1} is beyond ${cylinders} cylinders (check with benchCylinderIssues first)`,
      );
    }
  }
  return Array.from({ length: cylinders }, (_, i) => values[i] ?? null);
}

function returnFlowCheck(
  value: number,
  position: number,
  values: readonly (number | null)[],
  point: BenchPointInput,
): ReturnFlowCheck {
  const others = values.filter((v, i): v is number => v !== null && i !== position - 1);
  const limit = point.returnLimit ?? null;
  const overLimit = limit !== null && value - limit > BENCH_EDGE_EPSILON * Math.abs(limit);
  if (others.length < 2) {
    return { othersMedian: null, ratio: null, excess: null, worn: false, overLimit };
  }
  const m = median(others)!;
  const tol =
    point.tolerance.type === 'absolute' ? point.tolerance.value : (m * point.tolerance.value) / 100;
  const slack = BENCH_EDGE_EPSILON * (Math.abs(m) + tol);
  const excess = value - m;
  const worn = value - WORN_RETURN_FLOW_RATIO * m > slack && excess - tol > slack;
  return { othersMedian: m, ratio: m > 0 ? value / m : null, excess, worn, overLimit };
}

function toleranceWords(point: BenchPointInput): string {
  return point.tolerance.type === 'percent'
    ? `±${pctWords(point.tolerance.value)}`
    : `±${valueWords(point.tolerance.value, point.unit)}`;
}

/** How far an injector is off, in the tolerance's own terms: "−2.4 %" or "+0.7 mm³/stroke". */
function offWords(point: BenchPointInput, deviation: number, deviationPct: number | null): string {
  if (point.tolerance.type === 'percent' && deviationPct !== null)
    return signedPctWords(deviationPct);
  return signedValueWords(deviation, point.unit);
}

function pointSummary(
  point: BenchPointInput,
  cylinders: number,
  r: Omit<PointResult, 'summary'>,
): string {
  const s = r.statistics;
  if (s.n === 0 || s.mean === null) return 'No values recorded';
  const count = `${s.n} of ${cylinders} injector${cylinders === 1 ? '' : 's'}`;
  const parts: string[] = [count];
  const unit = benchUnitLabels[point.unit];
  if (point.kind === 'return-flow') {
    const checks = r.injectors.map((i) => i.returnFlow).filter((c) => c !== null);
    const worn = r.injectors.filter((i) => i.returnFlow?.worn).map((i) => i.position);
    const ratios = checks.map((c) => c.ratio).filter((x) => x !== null);
    if (worn.length) parts.push(`${injectorsWords(worn)} worn`);
    else if (checks.some((c) => c.othersMedian !== null))
      parts.push(
        ratios.length
          ? `none worn (highest ${ratioWords(Math.max(...ratios))} the others' median)`
          : 'none worn',
      );
    else parts.push('too few injectors to compare with each other');
    if (r.returnLimit !== null) {
      const over = r.injectors.filter((i) => i.returnFlow?.overLimit).map((i) => i.position);
      parts.push(
        over.length
          ? `${over.length === s.n && s.n > 1 ? 'every injector' : injectorsWords(over)} over the maker's limit of ${valueWords(r.returnLimit, point.unit)}`
          : `all within the maker's limit of ${valueWords(r.returnLimit, point.unit)}`,
      );
    }
    return parts.join('; ');
  }
  parts[0] = `${count}, mean ${roundForWords(s.mean)} ${unit}`;
  const tol = toleranceWords(point);
  if (r.meanBand) {
    const off = r.injectors.filter((i) => i.vsMean === 'low' || i.vsMean === 'high');
    if (off.length) parts.push(`${injectorsWords(off.map((i) => i.position))} outside ${tol}`);
    else if (point.tolerance.type === 'percent' && s.maxDeviationPct !== null)
      parts.push(`all within ±${pctWords(s.maxDeviationPct)} of it (tolerance ${tol})`);
    else {
      const maxDev = Math.max(...r.injectors.map((i) => Math.abs(i.deviation ?? 0)));
      parts.push(`all within ±${valueWords(maxDev, point.unit)} of it (tolerance ${tol})`);
    }
  } else parts.push('too few values to compare with each other');
  if (r.nominal !== null) {
    const meanOff = pctDiff(s.mean, r.nominal);
    const off = r.injectors.filter((i) => i.vsNominal === 'low' || i.vsNominal === 'high');
    parts.push(
      `maker's figure ${valueWords(r.nominal, point.unit)}${
        meanOff === null ? '' : ` (mean ${signedPctWords(meanOff)})`
      }${off.length ? `, ${injectorsWords(off.map((i) => i.position))} outside ${tol} of it` : ''}`,
    );
  }
  return parts.join('; ');
}

/**
 * One point's statistics and verdicts for positions 1…cylinders. Throws a
 * RangeError when a value sits beyond the last position or is not finite.
 */
export function analyseBenchPoint(
  point: BenchPointInput,
  index: number,
  cylinders: number,
): PointResult {
  const values = valuesByPosition(point.values, cylinders);
  const statistics = benchStatistics(values);
  const isReturn = point.kind === 'return-flow';
  const mean = statistics.mean;
  const meanBand =
    !isReturn && statistics.n >= 2 && mean !== null ? bandAround(mean, point.tolerance) : null;
  const nominal = isReturn ? null : (point.nominal ?? null);
  const nominalBand = nominal !== null ? bandAround(nominal, point.tolerance) : null;

  const injectors: InjectorResult[] = values.map((value, i) => {
    const position = i + 1;
    if (value === null) {
      return {
        position,
        value,
        deviation: null,
        deviationPct: null,
        vsMean: 'not-judged',
        vsNominal: 'not-judged',
        nominalDeviation: null,
        nominalDeviationPct: null,
        returnFlow: null,
        flags: [],
        status: 'missing',
      };
    }
    const vsMean = judge(value, meanBand);
    const vsNominal = judge(value, nominalBand);
    const returnFlow = isReturn ? returnFlowCheck(value, position, values, point) : null;
    const flags: InjectorFlag[] = [];
    if (vsMean === 'low' || vsMean === 'high') flags.push(vsMean);
    if (vsNominal === 'low') flags.push('below-nominal');
    if (vsNominal === 'high') flags.push('above-nominal');
    if (returnFlow?.worn) flags.push('worn');
    if (returnFlow?.overLimit) flags.push('over-limit');
    const judged = isReturn
      ? returnFlow!.othersMedian !== null || point.returnLimit != null
      : vsMean !== 'not-judged' || vsNominal !== 'not-judged';
    return {
      position,
      value,
      deviation: mean === null ? null : value - mean,
      deviationPct: mean === null ? null : pctDiff(value, mean),
      vsMean,
      vsNominal,
      nominalDeviation: nominal === null ? null : value - nominal,
      nominalDeviationPct: nominal === null ? null : pctDiff(value, nominal),
      returnFlow,
      flags,
      status: flags.length ? 'out-of-tolerance' : judged ? 'in-tolerance' : 'not-judged',
    };
  });

  const flaggedPositions = injectors.filter((i) => i.flags.length).map((i) => i.position);
  const status: PointStatus =
    statistics.n === 0
      ? 'no-values'
      : flaggedPositions.length
        ? 'out-of-tolerance'
        : injectors.some((i) => i.status === 'in-tolerance')
          ? 'in-tolerance'
          : 'not-judged';
  const result: Omit<PointResult, 'summary'> = {
    index,
    kind: point.kind,
    label: point.label,
    unit: point.unit,
    strokesPerMin: point.strokesPerMin ?? null,
    condition: point.condition ?? '',
    nominal,
    tolerance: point.tolerance,
    returnLimit: isReturn ? (point.returnLimit ?? null) : null,
    statistics,
    meanBand: meanBand && { low: meanBand.low, high: meanBand.high },
    nominalBand: nominalBand && { low: nominalBand.low, high: nominalBand.high },
    injectors,
    flaggedPositions,
    status,
  };
  return { ...result, summary: pointSummary(point, cylinders, result) };
}

const findingRank: Record<FindingKind, number> = {
  worn: 0,
  'over-limit': 1,
  'set-over-limit': 1,
  'set-below-nominal': 2,
  'set-above-nominal': 2,
  'below-nominal': 3,
  'above-nominal': 3,
  low: 3,
  high: 3,
  'not-measured': 4,
};

function pointFindings(point: BenchPointInput, r: PointResult): BenchFinding[] {
  const out: BenchFinding[] = [];
  const at = labelInSentence(point.label);
  const add = (kind: FindingKind, positions: number[], text: string) =>
    out.push({ kind, pointIndex: r.index, positions, text });
  const present = r.injectors.filter((i) => i.value !== null);

  if (point.kind === 'return-flow') {
    const limit = r.returnLimit;
    const over = present.filter((i) => i.returnFlow?.overLimit);
    const setOver = limit !== null && present.length > 1 && over.length === present.length;
    for (const i of present) {
      const c = i.returnFlow!;
      if (!c.worn) continue;
      const how =
        c.ratio !== null
          ? `${at} ${ratioWords(c.ratio)} the others'`
          : `${at} ${valueWords(i.value!, point.unit)} against none from the others`;
      const andLimit = c.overLimit && !setOver ? " and over the maker's limit" : '';
      add('worn', [i.position], `injector ${i.position} is worn (${how})${andLimit}`);
    }
    if (setOver) {
      const highest = Math.max(...present.map((i) => i.value!));
      add(
        'set-over-limit',
        over.map((i) => i.position),
        `every injector is over the maker's ${at} limit of ${valueWords(limit, point.unit)} (highest ${roundForWords(highest)})`,
      );
    } else {
      for (const i of over) {
        if (i.returnFlow!.worn) continue;
        add(
          'over-limit',
          [i.position],
          `injector ${i.position} is over the maker's ${at} limit (${roundForWords(i.value!)} against ${valueWords(limit!, point.unit)})`,
        );
      }
    }
  } else {
    // Against the maker's figure: the whole set at once when every injector is off the same way.
    const below = present.filter((i) => i.vsNominal === 'low');
    const above = present.filter((i) => i.vsNominal === 'high');
    const setWide =
      r.nominal !== null && present.length > 1
        ? below.length === present.length
          ? 'low'
          : above.length === present.length
            ? 'high'
            : null
        : null;
    if (setWide && r.nominal !== null && r.statistics.mean !== null) {
      const meanOff = pctDiff(r.statistics.mean, r.nominal);
      add(
        setWide === 'low' ? 'set-below-nominal' : 'set-above-nominal',
        present.map((i) => i.position),
        `the whole set is ${setWide} at ${at} against the maker's ${valueWords(r.nominal, point.unit)}${
          meanOff === null ? '' : ` (mean ${signedPctWords(meanOff)})`
        }`,
      );
    }
    for (const i of present) {
      const againstSet = i.vsMean === 'low' || i.vsMean === 'high';
      const againstMaker = !setWide && (i.vsNominal === 'low' || i.vsNominal === 'high');
      if (againstSet) {
        const makerNote = againstMaker
          ? `; ${offWords(point, i.nominalDeviation!, i.nominalDeviationPct)} against the maker's figure`
          : '';
        add(
          i.vsMean as 'low' | 'high',
          [i.position],
          `injector ${i.position} is ${i.vsMean} at ${at} (${offWords(point, i.deviation!, i.deviationPct)}${makerNote})`,
        );
      } else if (againstMaker) {
        add(
          i.vsNominal === 'low' ? 'below-nominal' : 'above-nominal',
          [i.position],
          `injector ${i.position} is ${i.vsNominal === 'low' ? 'below' : 'above'} the maker's figure at ${at} (${offWords(
            point,
            i.nominalDeviation!,
            i.nominalDeviationPct,
          )})`,
        );
      }
    }
  }
  const missing = r.injectors.filter((i) => i.value === null).map((i) => i.position);
  if (missing.length && present.length) {
    add('not-measured', missing, `${injectorsWords(missing)} not measured at ${at}`);
  } else if (missing.length) {
    add('not-measured', missing, `nothing recorded at ${at}`);
  }
  return out;
}

/** The point the "matched within" headline is about: full load, else the first point judged by the set. */
function headlinePoint(points: readonly PointResult[]): PointResult | null {
  const judged = points.filter((p) => p.meanBand !== null);
  return judged.find((p) => p.kind === 'full-load') ?? judged[0] ?? null;
}

function matchedWords(p: PointResult): string {
  const at = labelInSentence(p.label);
  if (p.tolerance.type === 'percent' && p.statistics.maxDeviationPct !== null)
    return `matched within ±${pctWords(p.statistics.maxDeviationPct)} at ${at}`;
  const maxDev = Math.max(...p.injectors.map((i) => Math.abs(i.deviation ?? 0)));
  return `matched within ±${valueWords(maxDev, p.unit)} at ${at}`;
}

/**
 * Judges every point of a sheet for a build with `cylinders` cylinders (by
 * default the longest list of values) and puts the set verdict in words:
 * "Matched within ±0.6 % at full load", or the findings worst first, e.g.
 * "Injector 3 is worn (return flow 2.1 × the others'); injector 5 is low at
 * full load (−2.4 %)".
 */
export function analyseBenchSheet(
  sheet: { points: readonly BenchPointInput[] },
  options: { cylinders?: number } = {},
): BenchSheetResult {
  const cylinders = options.cylinders ?? Math.max(1, ...sheet.points.map((p) => p.values.length));
  if (!Number.isInteger(cylinders) || cylinders < 1 || cylinders > BENCH_MAX_CYLINDERS) {
    throw new RangeError(
      `cylinders must be a whole number from 1 to ${BENCH_MAX_CYLINDERS} (got ${cylinders})`,
    );
  }
  const points = sheet.points.map((p, i) => analyseBenchPoint(p, i, cylinders));
  const findings = sheet.points
    .flatMap((p, i) => pointFindings(p, points[i]!))
    .map((f, order) => ({ f, order }))
    .sort((a, b) => findingRank[a.f.kind] - findingRank[b.f.kind] || a.order - b.order)
    .map(({ f }) => f);

  const anyValues = points.some((p) => p.statistics.n > 0);
  const problems = findings.filter((f) => f.kind !== 'not-measured');
  const status: SheetStatus = !anyValues
    ? 'no-values'
    : problems.length
      ? 'out-of-tolerance'
      : points.some((p) => p.status === 'in-tolerance')
        ? 'in-tolerance'
        : 'not-judged';

  let verdict: string;
  if (status === 'no-values') verdict = 'No values recorded yet';
  else {
    const head = headlinePoint(points);
    const phrases = findings.map((f) => f.text);
    if (status === 'in-tolerance' && head) phrases.unshift(matchedWords(head));
    else if (status === 'in-tolerance') phrases.unshift('every injector within tolerance');
    else if (status === 'not-judged')
      phrases.unshift("too few values to judge the set against each other or a maker's figure");
    verdict = capitalise(phrases.join('; '));
  }
  return { cylinders, points, findings, status, verdict };
}
