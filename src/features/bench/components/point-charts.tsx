import { useEffect, useRef, useState } from 'react';
import {
  Bar,
  BarChart,
  CartesianGrid,
  LabelList,
  Rectangle,
  ReferenceArea,
  ReferenceLine,
  XAxis,
  YAxis,
  type BarShapeProps,
} from 'recharts';
import type { BenchSheetResult, PointResult } from '@shared/schemas/bench';
import { roundForWords, toleranceText, unitText } from '../lib/format';

// The palette of styles.css (SVG fill attributes do not take CSS variables).
const colours = {
  bar: '#3b465b',
  flagged: '#b93226',
  band: '#e4f2e9',
  mean: '#1b2230',
  maker: '#a76a0c',
};

type Datum = { position: string; value: number | null; flagged: boolean };

function useWidth<T extends HTMLElement>() {
  const ref = useRef<T>(null);
  const [width, setWidth] = useState(0);
  useEffect(() => {
    const el = ref.current;
    if (!el) return;
    setWidth(el.clientWidth);
    const observer = new ResizeObserver(([entry]) => setWidth(entry.contentRect.width));
    observer.observe(el);
    return () => observer.disconnect();
  }, []);
  return [ref, width] as const;
}

/** A step of 1, 2 or 5 × a power of ten giving about four intervals over `range`. */
function niceStep(range: number): number {
  const raw = range / 4;
  const power = 10 ** Math.floor(Math.log10(raw));
  const m = raw / power;
  return (m <= 1 ? 1 : m <= 2 ? 2 : m <= 5 ? 5 : 10) * power;
}

/**
 * A y-axis around the values and the lines drawn, so a 1 % difference can be seen, on round
 * ticks. Return flow starts at zero: there the ratio between injectors is the point.
 */
function axisOf(p: PointResult): { domain: [number, number]; ticks: number[] } {
  const xs = p.injectors.flatMap((i) => (i.value === null ? [] : [i.value]));
  for (const band of [p.meanBand, p.nominalBand]) if (band) xs.push(band.low, band.high);
  if (p.returnLimit !== null) xs.push(p.returnLimit);
  if (p.kind === 'return-flow') xs.push(0);
  const lo = Math.min(...xs);
  const hi = Math.max(...xs);
  const step = niceStep(Math.max(hi - lo, Math.abs(hi) * 0.01, 0.01) * 1.2);
  const domain: [number, number] = [
    Math.max(0, Math.floor(lo / step - 0.25) * step),
    Math.ceil(hi / step + 0.25) * step,
  ];
  const ticks: number[] = [];
  for (let t = domain[0]; t <= domain[1] + step / 2; t += step)
    ticks.push(Number(t.toPrecision(10)));
  return { domain, ticks };
}

function PointChart({ point }: { point: PointResult }) {
  const [ref, width] = useWidth<HTMLDivElement>();
  const data: Datum[] = point.injectors.map((i) => ({
    position: String(i.position),
    value: i.value,
    flagged: i.flags.length > 0,
  }));
  const present = data.filter((d) => d.value !== null);
  if (present.length === 0) {
    return <p className="text-muted">No values at this point.</p>;
  }
  const { domain, ticks } = axisOf(point);
  const mean = point.statistics.mean;
  const fromZero = domain[0] === 0;
  return (
    <figure className="flex flex-col gap-2">
      <div
        ref={ref}
        className="w-full"
        role="img"
        aria-label={`${point.label}, one bar per injector. ${point.summary}.`}
      >
        {width > 0 && (
          <BarChart
            width={width}
            height={220}
            data={data}
            margin={{ top: 22, right: 8, bottom: 4, left: 0 }}
            barCategoryGap="18%"
            accessibilityLayer={false}
          >
            <CartesianGrid vertical={false} stroke="#e2dccf" />
            {point.meanBand && (
              <ReferenceArea
                y1={point.meanBand.low}
                y2={point.meanBand.high}
                fill={colours.band}
                fillOpacity={1}
                stroke="none"
                ifOverflow="hidden"
              />
            )}
            <XAxis
              dataKey="position"
              tickLine={false}
              stroke="#cfc6b4"
              tick={{ fill: '#1b2230', fontSize: 13, fontWeight: 600 }}
            />
            <YAxis
              type="number"
              domain={domain}
              allowDataOverflow
              width={width < 480 ? 44 : 56}
              tickFormatter={(v: number) => roundForWords(v)}
              tick={{ fill: '#5d6472', fontSize: 12 }}
              stroke="#cfc6b4"
              ticks={ticks}
            />
            <Bar
              dataKey="value"
              isAnimationActive={false}
              shape={(props: BarShapeProps) => (
                <Rectangle
                  {...props}
                  fill={(props.payload as Datum).flagged ? colours.flagged : colours.bar}
                />
              )}
            >
              <LabelList
                dataKey="value"
                position="top"
                fontSize={11}
                fill="#1b2230"
                // A halo of the card's colour keeps a value readable where the mean's line crosses it.
                halo={{ stroke: '#fffdf8', strokeWidth: 3 }}
                formatter={(v: unknown) => (typeof v === 'number' ? roundForWords(v) : '')}
              />
            </Bar>
            {mean !== null && point.kind !== 'return-flow' && (
              <ReferenceLine y={mean} stroke={colours.mean} strokeWidth={2} strokeDasharray="6 4" />
            )}
            {point.nominal !== null && (
              <ReferenceLine y={point.nominal} stroke={colours.maker} strokeWidth={2} />
            )}
            {point.returnLimit !== null && (
              <ReferenceLine y={point.returnLimit} stroke={colours.maker} strokeWidth={2} />
            )}
          </BarChart>
        )}
      </div>
      <figcaption className="text-sm text-ink-2">
        {unitText(point.unit)}.{' '}
        {point.kind === 'return-flow'
          ? 'Return flow is judged injector against injector (the worn rule), not against a band.'
          : `Dashed line: the set’s mean (${mean === null ? '–' : roundForWords(mean)}); green band: ${toleranceText(point)} of it.`}
        {point.nominal !== null &&
          ` Amber line: the maker’s figure (${roundForWords(point.nominal)}).`}
        {point.returnLimit !== null &&
          ` Amber line: the maker’s limit (${roundForWords(point.returnLimit)}).`}{' '}
        Red bars are out of tolerance.{!fromZero && ' The scale does not start at zero.'}
      </figcaption>
    </figure>
  );
}

/** One chart per test point: a bar per injector, the mean and the tolerance band. */
export function PointCharts({ result }: { result: BenchSheetResult }) {
  return (
    <div className="grid grid-cols-1 gap-6 lg:grid-cols-2">
      {result.points.map((p) => (
        <section key={p.index} aria-label={`Chart: ${p.label}`}>
          <h3 className="mb-1 font-bold">{p.label}</h3>
          <PointChart point={p} />
        </section>
      ))}
    </div>
  );
}
