import { useEffect, useRef, useState, type ReactNode } from 'react';
import {
  Bar,
  BarChart,
  CartesianGrid,
  Rectangle,
  ReferenceLine,
  XAxis,
  YAxis,
  type BarShapeProps,
  type YAxisTickContentProps,
} from 'recharts';
import {
  headroomStatusLabels,
  type EstimateResult,
  type HeadroomStatus,
} from '@shared/schemas/estimate';
import { formatNumber } from '@shared/format';
import { formatHeadroom } from '../format';

// The palette of styles.css (SVG fill attributes do not take CSS variables).
const colours: Record<HeadroomStatus, string> = {
  over: '#b93226',
  tight: '#a76a0c',
  ok: '#2e7d4f',
};

/** Bars are drawn up to this headroom either way; the label gives the real figure. */
const CLIP_PCT = 100;

type Datum = {
  id: string;
  name: string;
  headroom: number;
  shown: number;
  status: HeadroomStatus;
};

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

function truncate(text: string, max: number): string {
  return text.length > max ? `${text.slice(0, max - 1).trimEnd()}…` : text;
}

/** A part name over at most `lines` lines of about `max` characters, the last one cut short. */
function wrap(text: string, max: number, lines: number): string[] {
  const out: string[] = [];
  let line = '';
  for (const word of text.split(/\s+/)) {
    const next = line ? `${line} ${word}` : word;
    if (next.length <= max || !line) {
      line = next;
    } else {
      out.push(line);
      line = word;
    }
  }
  if (line) out.push(line);
  if (out.length <= lines) return out.map((l) => truncate(l, max));
  const kept = out.slice(0, lines);
  kept[lines - 1] = truncate(`${kept[lines - 1]} ${out.slice(lines).join(' ')}`, max);
  return kept;
}

/**
 * One bar per rated part: its headroom at the target in %, least first. The line at zero is
 * the target. Each bar's label says the figure and the status in words, so colour is never
 * the only cue.
 */
export function HeadroomChart({
  result,
  tightMarginPct,
}: {
  result: EstimateResult;
  tightMarginPct: number;
}) {
  const [ref, width] = useWidth<HTMLDivElement>();
  const data: Datum[] = [...result.components]
    .sort((a, b) => a.headroomPct.value - b.headroomPct.value)
    .map((c) => ({
      id: c.id,
      name: c.name,
      headroom: c.headroomPct.value,
      shown: Math.max(-CLIP_PCT, Math.min(CLIP_PCT, c.headroomPct.value)),
      status: c.status,
    }));
  const clipped = data.some((d) => d.shown !== d.headroom);
  const lo = Math.min(0, ...data.map((d) => d.shown));
  const hi = Math.max(tightMarginPct * 2, ...data.map((d) => d.shown));
  const narrow = width < 560;
  // Fewer, wider-spaced ticks on a phone, where the bars have about 180 px.
  const step = (hi - lo > 120 ? 50 : hi - lo > 60 ? 20 : 10) * (narrow ? 2 : 1);
  const domain: [number, number] = [Math.floor(lo / step) * step, Math.ceil(hi / step) * step];
  const ticks: number[] = [];
  for (let t = domain[0]; t <= domain[1]; t += step) ticks.push(t);

  const axisWidth = narrow ? 148 : 300;
  const nameChars = narrow ? 19 : 40;
  const nameLines = narrow ? 2 : 1;
  const rowHeight = narrow ? 66 : 52;
  const height = data.length * rowHeight + 44;

  const summary = data
    .map((d) => `${d.name}: ${formatHeadroom(d.headroom)}, ${headroomStatusLabels[d.status]}`)
    .join('; ');

  return (
    <figure className="flex flex-col gap-3">
      <div
        ref={ref}
        className="w-full"
        role="img"
        aria-label={`Headroom at the target. ${summary}`}
      >
        {width > 0 && (
          <BarChart
            width={width}
            height={height}
            data={data}
            layout="vertical"
            margin={{ top: 22, right: 12, bottom: 4, left: 0 }}
            barCategoryGap={12}
            accessibilityLayer={false}
          >
            <CartesianGrid horizontal={false} stroke="#e2dccf" />
            <XAxis
              type="number"
              dataKey="shown"
              domain={domain}
              ticks={ticks}
              allowDataOverflow
              tickFormatter={(v: number) =>
                `${v > 0 ? '+' : v < 0 ? '−' : ''}${formatNumber(Math.abs(v), 0)} %`
              }
              tick={{ fill: '#5d6472', fontSize: 13 }}
              stroke="#cfc6b4"
            />
            <YAxis
              type="category"
              dataKey="id"
              width={axisWidth}
              interval={0}
              tickLine={false}
              stroke="#cfc6b4"
              tick={(props: YAxisTickContentProps) => {
                const d = data.find((item) => item.id === props.payload?.value);
                if (!d) return <g />;
                const lines = wrap(d.name, nameChars, nameLines);
                const top = -4 - (lines.length - 1) * 8;
                return (
                  <g transform={`translate(${Number(props.x) - 8},${Number(props.y)})`}>
                    <text textAnchor="end" y={top} fill="#1b2230" fontSize={14} fontWeight={600}>
                      <title>{d.name}</title>
                      {lines.map((l, i) => (
                        <tspan key={i} x={0} dy={i === 0 ? 0 : 16}>
                          {l}
                        </tspan>
                      ))}
                    </text>
                    <text
                      textAnchor="end"
                      y={top + lines.length * 16 + 2}
                      fill={colours[d.status]}
                      fontSize={13}
                      fontWeight={700}
                    >
                      {formatHeadroom(d.headroom)} · {headroomStatusLabels[d.status]}
                    </text>
                  </g>
                );
              }}
            />
            <ReferenceLine
              x={0}
              stroke="#1b2230"
              strokeWidth={2}
              label={{
                value: 'Target',
                position: 'top',
                fill: '#1b2230',
                fontSize: 13,
                fontWeight: 700,
              }}
            />
            <Bar
              dataKey="shown"
              isAnimationActive={false}
              shape={(props: BarShapeProps) => (
                <Rectangle {...props} fill={colours[(props.payload as Datum).status]} />
              )}
            />
          </BarChart>
        )}
      </div>
      <figcaption className="flex flex-col gap-2 text-[15px] text-ink-2">
        <p>
          Headroom of each rated part at the target. The dark line at 0 is the target: a bar to its
          right has that much to spare, a bar to its left falls short.
          {clipped && ` Bars stop at ±${CLIP_PCT} %; the label gives the full figure.`}
        </p>
        <ul className="flex flex-wrap gap-x-5 gap-y-1" aria-label="Key">
          <Key colour={colours.over} word="Over">
            needs more than its rating
          </Key>
          <Key colour={colours.tight} word="Tight">
            under {formatNumber(tightMarginPct, 1)} % headroom
          </Key>
          <Key colour={colours.ok} word="OK">
            {formatNumber(tightMarginPct, 1)} % or more
          </Key>
        </ul>
      </figcaption>
    </figure>
  );
}

function Key({ colour, word, children }: { colour: string; word: string; children: ReactNode }) {
  return (
    <li className="flex items-center gap-1.5">
      <span
        aria-hidden
        className="inline-block size-3.5 rounded-sm"
        style={{ background: colour }}
      />
      <span>
        <strong>{word}</strong>: {children}
      </span>
    </li>
  );
}
