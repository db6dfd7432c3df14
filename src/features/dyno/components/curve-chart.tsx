import {
  CartesianGrid,
  Legend,
  Line,
  LineChart,
  ReferenceLine,
  ResponsiveContainer,
  Tooltip,
  XAxis,
  YAxis,
} from 'recharts';
import { formatNumber } from '@shared/format';
import type { PowerBasis } from '@shared/schemas/dyno';

// recharts is only imported by this file, which the session page loads lazily.

/** One run's curve, already corrected (or not) and in hp and lbf·ft. */
export type ChartRun = {
  id: string;
  label: string;
  colour: string;
  points: { rpm: number; hp: number; lbft: number }[];
};

const colours = { grid: '#e2dccf', axis: '#5d6472', target: '#1b2230' };
const axisTick = { fill: colours.axis, fontSize: 13 };
const legendText = (value: string) => <span style={{ color: '#2a3344' }}>{value}</span>;

function CurveChart({
  runs,
  value,
  unit,
  target,
  targetLabel,
  name,
}: {
  runs: ChartRun[];
  value: 'hp' | 'lbft';
  unit: string;
  target: number | null;
  targetLabel: string;
  name: string;
}) {
  return (
    <div className="h-72 w-full sm:h-80">
      <ResponsiveContainer width="100%" height="100%">
        <LineChart margin={{ top: 16, right: 12, bottom: 4, left: 0 }}>
          <CartesianGrid stroke={colours.grid} />
          <XAxis
            type="number"
            dataKey="rpm"
            domain={['dataMin', 'dataMax']}
            allowDuplicatedCategory={false}
            tickFormatter={(v: number) => formatNumber(v, 0)}
            tick={axisTick}
            stroke={colours.grid}
            label={{
              value: 'rpm',
              position: 'insideBottomRight',
              offset: -2,
              fill: colours.axis,
              fontSize: 13,
            }}
          />
          <YAxis
            tick={axisTick}
            stroke={colours.grid}
            width={52}
            tickFormatter={(v: number) => formatNumber(v, 0)}
            domain={[0, 'auto']}
          />
          <Tooltip
            labelFormatter={(rpm) => `${formatNumber(Number(rpm), 0)} rpm`}
            formatter={(v, series) => [`${formatNumber(Number(v), 1)} ${unit}`, series]}
          />
          <Legend wrapperStyle={{ fontSize: 14 }} formatter={legendText} />
          {target != null && (
            <ReferenceLine
              y={target}
              stroke={colours.target}
              strokeDasharray="6 4"
              strokeWidth={1.5}
              ifOverflow="extendDomain"
              label={{
                value: targetLabel,
                position: 'insideBottomLeft',
                fill: colours.target,
                fontSize: 13,
              }}
            />
          )}
          {runs.map((r) => (
            <Line
              key={r.id}
              data={r.points}
              dataKey={value}
              name={r.label}
              stroke={r.colour}
              strokeWidth={2}
              dot={false}
              type="monotone"
              isAnimationActive={false}
            />
          ))}
        </LineChart>
      </ResponsiveContainer>
      <span className="sr-only">{name}</span>
    </div>
  );
}

/** Power and torque against rpm, one line per chosen run, with the target drawn in the same basis. */
export function RunCurves({
  runs,
  basis,
  targetHp,
  targetLbft,
}: {
  runs: ChartRun[];
  basis: PowerBasis;
  targetHp: number | null;
  targetLbft: number | null;
}) {
  return (
    <div className="flex flex-col gap-4">
      <div>
        <h3 className="mb-1 font-semibold text-ink">Power, {basis} hp</h3>
        <CurveChart
          runs={runs}
          value="hp"
          unit="hp"
          target={targetHp}
          targetLabel={targetHp != null ? `Target ${formatNumber(targetHp, 1)} ${basis} hp` : ''}
          name="Power against rpm"
        />
      </div>
      <div>
        <h3 className="mb-1 font-semibold text-ink">Torque, lbf·ft ({basis})</h3>
        <CurveChart
          runs={runs}
          value="lbft"
          unit="lbf·ft"
          target={targetLbft}
          targetLabel={targetLbft != null ? `Target ${formatNumber(targetLbft, 0)} lbf·ft` : ''}
          name="Torque against rpm"
        />
      </div>
    </div>
  );
}
