import type { BenchComparisonAnswer, PointComparison } from '@shared/schemas/bench';
import { hpWords, pctWords } from '@shared/bench';
import { Section } from '@/components/ui/card';
import { cn } from '@/components/ui/cn';
import { BenchWorking } from './bench-working';
import { signedPctWords, signedValueWords, unitText, valueText } from '../lib/format';

function pct(x: number | null) {
  return x === null ? '–' : pctWords(x);
}

/** A change in percentage points: "−1.9 points". */
function pointsText(x: number | null) {
  if (x === null) return '–';
  const t = pctWords(x).replace(' %', '');
  return `${x > 0 && t !== '0' ? '+' : ''}${t} pts`;
}

function PointTable({ point }: { point: PointComparison }) {
  const rows: { label: string; before: string; after: string; change: string; better?: boolean }[] =
    [
      {
        label: 'Mean',
        before: valueText(point.before.mean),
        after: valueText(point.after.mean),
        change: point.meanChangePct === null ? '–' : signedPctWords(point.meanChangePct),
      },
      {
        label: 'Spread',
        before: pct(point.before.spreadPct),
        after: pct(point.after.spreadPct),
        change: pointsText(point.spreadChange),
        better: point.spreadChange !== null && point.spreadChange < 0,
      },
      {
        label: 'CV',
        before: pct(point.before.cvPct),
        after: pct(point.after.cvPct),
        change: pointsText(point.cvChange),
        better: point.cvChange !== null && point.cvChange < 0,
      },
      {
        label: 'Largest off mean',
        before: pct(point.before.maxDeviationPct),
        after: pct(point.after.maxDeviationPct),
        change: pointsText(point.maxDeviationChange),
        better: point.maxDeviationChange !== null && point.maxDeviationChange < 0,
      },
    ];
  return (
    <div className="flex flex-col gap-3">
      <table className="w-full border-collapse text-[15px] tabular-nums">
        <caption className="sr-only">{point.label}: each injector before and after</caption>
        <thead>
          <tr className="border-b-2 border-rule-strong text-right text-sm">
            <th scope="col" className="py-1.5 pr-2 text-left font-semibold text-muted">
              Injector
            </th>
            <th scope="col" className="px-2 py-1.5 font-semibold">
              Before
            </th>
            <th scope="col" className="px-2 py-1.5 font-semibold">
              After
            </th>
            <th scope="col" className="px-2 py-1.5 font-semibold">
              Change
            </th>
            <th scope="col" className="py-1.5 pl-2 font-semibold">
              %
            </th>
          </tr>
        </thead>
        <tbody className="divide-y divide-rule">
          {point.injectors.map((i) => (
            <tr key={i.position} className="text-right">
              <th scope="row" className="py-1.5 pr-2 text-left font-bold">
                {i.position}
              </th>
              <td className="px-2 py-1.5">{valueText(i.before)}</td>
              <td className="px-2 py-1.5 font-semibold">{valueText(i.after)}</td>
              <td className="px-2 py-1.5 whitespace-nowrap">
                {i.change === null
                  ? '–'
                  : signedValueWords(i.change, point.unit).replace(` ${unitText(point.unit)}`, '')}
              </td>
              <td className="py-1.5 pl-2 whitespace-nowrap">
                {i.changePct === null ? '–' : signedPctWords(i.changePct)}
              </td>
            </tr>
          ))}
        </tbody>
      </table>
      <table className="w-full border-collapse text-[15px] tabular-nums">
        <caption className="sr-only">{point.label}: the set before and after</caption>
        <thead>
          <tr className="border-b border-rule-strong text-right text-sm">
            <th scope="col" className="py-1 pr-2 text-left font-semibold text-muted">
              The set
            </th>
            <th scope="col" className="px-2 py-1 font-semibold">
              Before
            </th>
            <th scope="col" className="px-2 py-1 font-semibold">
              After
            </th>
            <th scope="col" className="py-1 pl-2 font-semibold">
              Change
            </th>
          </tr>
        </thead>
        <tbody className="divide-y divide-rule bg-paper/60">
          {rows.map((r) => (
            <tr key={r.label} className="text-right">
              <th scope="row" className="py-1 pr-2 text-left font-semibold text-ink-2">
                {r.label}
              </th>
              <td className="px-2 py-1">{r.before}</td>
              <td className="px-2 py-1 font-semibold">{r.after}</td>
              <td
                className={cn('py-1 pl-2 whitespace-nowrap', r.better && 'font-semibold text-ok')}
              >
                {r.change}
              </td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}

/** Two sheets of one injector set side by side: each injector's change at each point. */
export function ComparisonView({ answer }: { answer: BenchComparisonAnswer }) {
  const { comparison, recovery, target } = answer;
  return (
    <div className="flex flex-col gap-5">
      <Section id="recovered" title="What the change is worth">
        {recovery.recovered ? (
          <div className="flex flex-col gap-3">
            <p className="text-2xl font-bold tabular-nums" data-testid="recovered-hp">
              About {hpWords(Math.abs(recovery.recovered.value))}{' '}
              {recovery.recovered.value >= 0 ? 'won back' : 'lost'}
            </p>
            <p className="text-ink-2">
              {recovery.summary}. Before, the imbalance cost about{' '}
              {recovery.before.available ? hpWords(recovery.before.power.value) : '–'}; after, about{' '}
              {recovery.after.available ? hpWords(recovery.after.power.value) : '–'}, at{' '}
              {target.powerHp} {target.basis} hp.
            </p>
            <BenchWorking figures={[recovery.recovered]} label="power won back" />
          </div>
        ) : (
          <p className="text-ink-2">Not worked out: {recovery.reason}.</p>
        )}
      </Section>

      <div className="grid grid-cols-1 gap-5 lg:grid-cols-2">
        {comparison.points.map((p) => (
          <Section
            key={`${p.kind}-${p.label}`}
            id={`compare-${p.kind}-${p.label.replace(/\W+/g, '-').toLowerCase()}`}
            title={`${p.label} (${unitText(p.unit)})`}
          >
            {p.converted && (
              <p className="mb-2 text-sm text-muted">
                The after sheet recorded this point in another unit; its values are restated in{' '}
                {unitText(p.unit)}.
              </p>
            )}
            <PointTable point={p} />
          </Section>
        ))}
      </div>

      {(comparison.onlyBefore.length > 0 ||
        comparison.onlyAfter.length > 0 ||
        comparison.notComparable.length > 0) && (
        <div className="text-[15px] text-ink-2">
          {comparison.onlyBefore.length > 0 && (
            <p>
              Only on the earlier sheet: {comparison.onlyBefore.map((p) => p.label).join(', ')}.
            </p>
          )}
          {comparison.onlyAfter.length > 0 && (
            <p>Only on the later sheet: {comparison.onlyAfter.map((p) => p.label).join(', ')}.</p>
          )}
          {comparison.notComparable.map((p) => (
            <p key={p.label}>
              {p.label}: not compared. {p.reason}.
            </p>
          ))}
        </div>
      )}
    </div>
  );
}
