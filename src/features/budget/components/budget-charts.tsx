import {
  Area,
  AreaChart,
  Bar,
  BarChart,
  CartesianGrid,
  Legend,
  ReferenceLine,
  ResponsiveContainer,
  Tooltip,
  XAxis,
  YAxis,
} from 'recharts';
import { axisToDate } from '@shared/dates';
import { formatIsoDate, formatMoney, minorUnitDigits } from '@shared/format';
import { partCategoryLabels, type Budget } from '@shared/schemas/parts';
import { dayTime, formatTick, timeDomain, timeTicks } from '../lib/time-axis';

// recharts is only imported by this file, which only the lazily loaded budget page uses.
//
// Both charts are pictures of figures the page also gives as text (the category table, the
// totals), and the page hides them from assistive technology. recharts' accessibility layer
// (on by default in v3) makes each chart's <svg> a Tab stop with arrow-key tooltips; inside an
// aria-hidden figure that is a focus stop a screen reader cannot name (axe: aria-hidden-focus),
// so it is switched off and the charts take no focus.

const colours = {
  planned: '#cfc6b4',
  committed: '#7c879b',
  spent: '#b8501d',
  budget: '#b93226',
  grid: '#e2dccf',
  axis: '#5d6472',
};

/** Short money for axis ticks: "$12K". Figures a person reads in full use formatMoney. */
function compactMoney(cents: number, currency: string): string {
  const major = cents / 10 ** minorUnitDigits(currency);
  try {
    return new Intl.NumberFormat(undefined, {
      style: 'currency',
      currency,
      currencyDisplay: 'narrowSymbol',
      notation: 'compact',
      maximumFractionDigits: 1,
    }).format(major);
  } catch {
    return String(Math.round(major));
  }
}

const axisTick = { fill: colours.axis, fontSize: 13 };

/** Legend words in ink, not in the (sometimes pale) series colour. */
const legendText = (value: string) => <span style={{ color: '#2a3344' }}>{value}</span>;

/** Planned against spent, one pair of bars a category. */
export function CategoryChart({ budget }: { budget: Budget }) {
  const { currency } = budget;
  const data = budget.categories.map((line) => ({
    name: partCategoryLabels[line.category],
    planned: line.plannedCents,
    spent: line.spentCents,
  }));
  const height = Math.max(180, data.length * 52 + 70);
  return (
    <div style={{ height }} className="w-full">
      <ResponsiveContainer width="100%" height="100%">
        <BarChart
          accessibilityLayer={false}
          data={data}
          layout="vertical"
          margin={{ top: 4, right: 16, bottom: 4, left: 4 }}
          barGap={2}
        >
          <CartesianGrid horizontal={false} stroke={colours.grid} />
          <XAxis
            type="number"
            tickFormatter={(v: number) => compactMoney(v, currency)}
            tick={axisTick}
            stroke={colours.grid}
          />
          <YAxis
            type="category"
            dataKey="name"
            width={118}
            tick={axisTick}
            stroke={colours.grid}
            interval={0}
          />
          <Tooltip
            formatter={(value) => formatMoney(Number(value), currency)}
            cursor={{ fill: 'rgba(27,34,48,0.05)' }}
          />
          <Legend wrapperStyle={{ fontSize: 14 }} formatter={legendText} />
          <Bar
            dataKey="planned"
            name="Planned"
            fill={colours.planned}
            radius={[0, 3, 3, 0]}
            isAnimationActive={false}
          />
          <Bar
            dataKey="spent"
            name="Spent"
            fill={colours.spent}
            radius={[0, 3, 3, 0]}
            isAnimationActive={false}
          />
        </BarChart>
      </ResponsiveContainer>
    </div>
  );
}

/**
 * Money committed and spent so far, added up day by day, against the budget line. The
 * x axis is time: each date sits at its distance in days from the others.
 */
export function SpendingChart({ budget }: { budget: Budget }) {
  const { currency } = budget;
  const data = budget.spendingOverTime.map((p) => ({
    t: dayTime(p.date),
    date: p.date,
    committed: p.committedCents,
    spent: p.spentCents,
  }));
  const domain = timeDomain(data.map((d) => d.t));
  const { ticks, unit } = timeTicks(domain[0], domain[1]);
  return (
    <div className="h-72 w-full">
      <ResponsiveContainer width="100%" height="100%">
        <AreaChart
          accessibilityLayer={false}
          data={data}
          margin={{ top: 12, right: 16, bottom: 4, left: 4 }}
        >
          <CartesianGrid vertical={false} stroke={colours.grid} />
          <XAxis
            dataKey="t"
            type="number"
            scale="time"
            domain={domain}
            ticks={ticks}
            tickFormatter={(t: number) => formatTick(t, unit)}
            tick={axisTick}
            stroke={colours.grid}
            interval={0}
          />
          <YAxis
            tickFormatter={(v: number) => compactMoney(v, currency)}
            tick={axisTick}
            stroke={colours.grid}
            width={64}
          />
          <Tooltip
            labelFormatter={(t) => formatIsoDate(axisToDate(Number(t)))}
            formatter={(value) => formatMoney(Number(value), currency)}
          />
          <Legend wrapperStyle={{ fontSize: 14 }} formatter={legendText} />
          {budget.budgetCents > 0 && (
            <ReferenceLine
              y={budget.budgetCents}
              stroke={colours.budget}
              strokeDasharray="6 4"
              ifOverflow="extendDomain"
              label={{
                value: `Budget ${compactMoney(budget.budgetCents, currency)}`,
                position: 'insideTopLeft',
                fill: colours.budget,
                fontSize: 13,
              }}
            />
          )}
          <Area
            type="stepAfter"
            dataKey="committed"
            name="Committed"
            stroke={colours.committed}
            fill={colours.committed}
            fillOpacity={0.18}
            strokeWidth={2}
            isAnimationActive={false}
          />
          <Area
            type="stepAfter"
            dataKey="spent"
            name="Spent"
            stroke={colours.spent}
            fill={colours.spent}
            fillOpacity={0.28}
            strokeWidth={2}
            isAnimationActive={false}
          />
        </AreaChart>
      </ResponsiveContainer>
    </div>
  );
}
