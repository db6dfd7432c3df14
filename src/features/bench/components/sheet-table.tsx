import { TriangleAlert } from 'lucide-react';
import { injectorFlagLabels, type BenchSheetResult, type PointResult } from '@shared/schemas/bench';
import { cn } from '@/components/ui/cn';
import {
  deviationText,
  flagShort,
  pctWords,
  ratioWords,
  sortedFlags,
  toleranceText,
  unitText,
  valueText,
} from '../lib/format';

function Cell({ point, position }: { point: PointResult; position: number }) {
  const i = point.injectors[position - 1]!;
  if (i.value === null) {
    return (
      <td className="px-2 py-1.5 text-right text-muted">
        –<span className="sr-only">not measured</span>
      </td>
    );
  }
  const flags = sortedFlags(i.flags);
  const flagged = flags.length > 0;
  const under =
    point.kind === 'return-flow'
      ? i.returnFlow?.ratio != null
        ? `${ratioWords(i.returnFlow.ratio)} others`
        : null
      : deviationText(point, i.deviation, i.deviationPct)?.replace(` ${unitText(point.unit)}`, '');
  return (
    <td
      className={cn(
        'px-2 py-1.5 text-right align-top tabular-nums',
        flagged && 'bg-over-soft text-[#7d1f17]',
      )}
      data-flagged={flagged || undefined}
      title={flags.map((f) => injectorFlagLabels[f]).join('; ') || undefined}
    >
      <span className="block text-base font-semibold">{valueText(i.value)}</span>
      {under && <span className="block text-xs whitespace-nowrap">{under}</span>}
      {flagged && (
        <span className="mt-0.5 flex items-center justify-end gap-0.5 text-xs font-bold whitespace-nowrap">
          <TriangleAlert aria-hidden className="size-3.5 shrink-0" />
          {flags.map((f) => flagShort[f]).join(', ')}
        </span>
      )}
    </td>
  );
}

function FootRow({
  label,
  points,
  render,
}: {
  label: string;
  points: PointResult[];
  render: (p: PointResult) => string;
}) {
  return (
    <tr>
      <th
        scope="row"
        className="sticky left-0 w-px min-w-[4.5rem] bg-paper px-2 py-1 text-left text-sm leading-tight font-semibold text-ink-2"
      >
        {label}
      </th>
      {points.map((p) => (
        <td key={p.index} className="px-2 py-1 text-right text-sm whitespace-nowrap tabular-nums">
          {render(p)}
        </td>
      ))}
    </tr>
  );
}

/**
 * The sheet as the bench gave it: a row per injector, a column per test point. Each value
 * carries how far it sits from the set's mean (or, for return flow, how many times the
 * others' median it is); an outlier is shaded and named in words. The foot gives each
 * point's mean, spread and coefficient of variation.
 */
export function SheetTable({ result, caption }: { result: BenchSheetResult; caption: string }) {
  const points = result.points;
  const positions = Array.from({ length: result.cylinders }, (_, i) => i + 1);
  const pct = (x: number | null) => (x === null ? '–' : pctWords(x));
  return (
    // Wider than a phone: a keyboard user scrolls it too, so it takes focus and has a name.
    <div
      className="-mx-4 overflow-x-auto focus-visible:outline-2 focus-visible:outline-accent-600 sm:mx-0"
      tabIndex={0}
      role="region"
      aria-label="The sheet's values by injector; scroll sideways for more"
    >
      <table className="min-w-full border-collapse text-[15px]">
        <caption className="sr-only">{caption}</caption>
        <thead>
          <tr className="border-b-2 border-rule-strong">
            <th
              scope="col"
              className="sticky left-0 w-px bg-sheet px-2 py-2 text-left text-sm font-semibold whitespace-nowrap text-muted"
            >
              <span aria-hidden>Inj.</span>
              <span className="sr-only">Injector</span>
            </th>
            {points.map((p) => (
              <th
                key={p.index}
                scope="col"
                className="min-w-[5.5rem] px-2 py-2 text-right align-bottom"
              >
                <span className="block leading-tight font-bold">{p.label}</span>
                <span className="block text-xs font-normal text-muted">{unitText(p.unit)}</span>
                <span className="block text-xs font-normal text-muted">{toleranceText(p)}</span>
              </th>
            ))}
          </tr>
        </thead>
        <tbody className="divide-y divide-rule">
          {positions.map((position) => (
            <tr key={position}>
              <th
                scope="row"
                className="sticky left-0 w-px bg-sheet px-3 py-1.5 text-left font-bold tabular-nums"
              >
                {position}
              </th>
              {points.map((p) => (
                <Cell key={p.index} point={p} position={position} />
              ))}
            </tr>
          ))}
        </tbody>
        <tfoot className="border-t-2 border-rule-strong bg-paper">
          <FootRow label="Mean" points={points} render={(p) => valueText(p.statistics.mean)} />
          <FootRow label="Spread" points={points} render={(p) => pct(p.statistics.spreadPct)} />
          <FootRow label="CV" points={points} render={(p) => pct(p.statistics.cvPct)} />
          <FootRow
            label="Max off mean"
            points={points}
            render={(p) => pct(p.statistics.maxDeviationPct)}
          />
          {points.some((p) => p.nominal !== null || p.returnLimit !== null) && (
            <FootRow
              label="Maker’s figure"
              points={points}
              render={(p) =>
                p.nominal !== null
                  ? valueText(p.nominal)
                  : p.returnLimit !== null
                    ? `≤ ${valueText(p.returnLimit)}`
                    : '–'
              }
            />
          )}
        </tfoot>
      </table>
    </div>
  );
}
