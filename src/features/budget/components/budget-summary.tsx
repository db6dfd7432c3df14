import type { ReactNode } from 'react';
import { Link } from 'react-router-dom';
import { formatMoney } from '@shared/format';
import { partCategoryLabels, type Budget } from '@shared/schemas/parts';
import { Alert } from '@/components/ui/alert';
import { cn } from '@/components/ui/cn';
import { paths } from '@/config/paths';

function Figure({
  label,
  value,
  note,
  tone,
}: {
  label: string;
  value: ReactNode;
  note?: ReactNode;
  tone?: 'over' | 'ok';
}) {
  return (
    <div className="rounded-lg border border-rule bg-sheet px-4 py-3">
      <dt className="text-sm font-semibold tracking-wide text-muted uppercase">{label}</dt>
      <dd
        className={cn(
          'mt-0.5 text-2xl font-bold tabular-nums',
          tone === 'over' && 'text-over',
          tone === 'ok' && 'text-ok',
        )}
      >
        {value}
      </dd>
      {note && <dd className="text-sm text-muted">{note}</dd>}
    </div>
  );
}

/** The money of the build at a glance. */
export function BudgetTotals({ budget, buildId }: { budget: Budget; buildId: string }) {
  const m = (cents: number) => formatMoney(cents, budget.currency);
  const { totals } = budget;
  const hasBudget = budget.budgetCents > 0;
  return (
    <dl aria-label="Budget totals" className="grid grid-cols-2 gap-3 lg:grid-cols-3">
      <Figure
        label="Budget"
        value={hasBudget ? m(budget.budgetCents) : 'Not set'}
        note={
          hasBudget ? (
            budget.currency
          ) : (
            <Link
              to={paths.builds.edit.getHref(buildId)}
              className="font-semibold text-accent-700 underline"
            >
              Set a budget
            </Link>
          )
        }
      />
      <Figure
        label="Planned"
        value={m(totals.plannedCents)}
        note={`${totals.partCount} ${totals.partCount === 1 ? 'part' : 'parts'}, not counting sent-back`}
      />
      <Figure label="Committed" value={m(totals.committedCents)} note="Ordered or further along" />
      <Figure label="Spent" value={m(totals.spentCents)} note="In hand, at a shop or installed" />
      <Figure
        label="Core charges owed back"
        value={m(totals.coreOwedCents)}
        note="Refunds due when old cores go back"
      />
      {hasBudget ? (
        <Figure
          label="Remaining"
          value={m(budget.remainingAfterPlannedCents)}
          tone={budget.remainingAfterPlannedCents < 0 ? 'over' : undefined}
          note={`after everything planned; ${m(budget.remainingAfterSpentCents)} after what is spent`}
        />
      ) : (
        <Figure label="Remaining" value="—" note="Needs a budget" />
      )}
    </dl>
  );
}

/**
 * Spent, committed and planned money as one bar against the budget, so how close the
 * build is to its limit reads at a glance before any chart.
 */
export function BudgetMeter({ budget }: { budget: Budget }) {
  const { totals, budgetCents } = budget;
  if (budgetCents <= 0) return null;
  const scale = Math.max(budgetCents, totals.plannedCents);
  const pct = (cents: number) => `${Math.max(0, (cents / scale) * 100)}%`;
  const committedOnly = totals.committedCents - totals.spentCents;
  const plannedOnly = totals.plannedCents - totals.committedCents;
  return (
    <div aria-hidden className="rounded-lg border border-rule bg-sheet px-4 py-3">
      <div className="relative flex h-5 overflow-hidden rounded bg-paper ring-1 ring-rule">
        <div style={{ width: pct(totals.spentCents) }} className="bg-accent-600" />
        <div style={{ width: pct(committedOnly) }} className="bg-[#7c879b]" />
        <div
          style={{ width: pct(plannedOnly) }}
          className="bg-[repeating-linear-gradient(135deg,#cfc6b4_0_4px,#e9e3d6_4px_8px)]"
        />
        <div
          style={{ left: pct(budgetCents) }}
          className="absolute inset-y-0 w-0.5 -translate-x-1/2 bg-over"
        />
      </div>
      <div className="mt-2 flex flex-wrap gap-x-4 gap-y-1 text-sm text-ink-2">
        <span className="inline-flex items-center gap-1.5">
          <span className="size-3 rounded-sm bg-accent-600" /> Spent
        </span>
        <span className="inline-flex items-center gap-1.5">
          <span className="size-3 rounded-sm bg-[#7c879b]" /> Committed
        </span>
        <span className="inline-flex items-center gap-1.5">
          <span className="size-3 rounded-sm bg-[#cfc6b4]" /> Planned
        </span>
        <span className="inline-flex items-center gap-1.5">
          <span className="h-3 w-0.5 bg-over" /> Budget
        </span>
      </div>
    </div>
  );
}

/** Going over is said plainly, with the part that tips it and by how much. */
export function OverBudgetBanner({ budget, buildId }: { budget: Budget; buildId: string }) {
  if (budget.budgetCents <= 0 || !budget.overBudget) return null;
  const m = (cents: number) => formatMoney(cents, budget.currency);
  const over = budget.tippingPart?.overByCents ?? -budget.remainingAfterPlannedCents;
  return (
    <Alert tone="error" title={`Over budget by ${m(over)}`}>
      <p>
        Everything planned comes to {m(budget.totals.plannedCents)} against a budget of{' '}
        {m(budget.budgetCents)}.
        {budget.tippingPart && (
          <>
            {' '}
            Counting money in the order it goes out (spent, then committed, then planned), the part
            that takes the build over is{' '}
            <Link
              to={`${paths.builds.parts.getHref(buildId)}?q=${encodeURIComponent(budget.tippingPart.name)}`}
              className="font-bold underline"
            >
              {budget.tippingPart.name}
            </Link>
            .
          </>
        )}
      </p>
    </Alert>
  );
}

/** The chart's figures as a table: readable without the chart, and by screen readers. */
export function CategoryTable({ budget }: { budget: Budget }) {
  const m = (cents: number) => formatMoney(cents, budget.currency);
  // On a phone the table keeps the chart's pair (planned, spent) as columns and puts the
  // rest under the category name, so nothing hides off the right edge.
  const wideOnly = 'hidden sm:table-cell';
  const rows = [
    ...budget.categories.map((line) => ({
      key: line.category,
      label: partCategoryLabels[line.category],
      line,
    })),
    { key: 'all', label: 'All categories', line: budget.totals },
  ];
  return (
    <div className="overflow-x-auto rounded-lg border border-rule">
      <table className="w-full border-collapse text-left text-[15px]">
        <caption className="sr-only">Money by category</caption>
        <thead>
          <tr className="border-b border-rule-strong bg-paper/70 text-sm text-ink-2">
            <th scope="col" className="px-3 py-2">
              Category
            </th>
            <th scope="col" className={cn('px-3 py-2 text-right', wideOnly)}>
              Parts
            </th>
            <th scope="col" className="px-3 py-2 text-right">
              Planned
            </th>
            <th scope="col" className={cn('px-3 py-2 text-right', wideOnly)}>
              Committed
            </th>
            <th scope="col" className="px-3 py-2 text-right">
              Spent
            </th>
            <th scope="col" className={cn('px-3 py-2 text-right', wideOnly)}>
              Core owed
            </th>
          </tr>
        </thead>
        <tbody className="tabular-nums">
          {rows.map(({ key, label, line }) => (
            <tr
              key={key}
              className={cn(
                'border-b border-rule last:border-b-0',
                key === 'all' && 'border-t-2 border-t-rule-strong font-bold',
              )}
            >
              <th scope="row" className="px-3 py-2 align-top font-semibold">
                {label}
                <span className="block text-sm font-normal text-muted sm:hidden">
                  {line.partCount} {line.partCount === 1 ? 'part' : 'parts'} · committed{' '}
                  {m(line.committedCents)}
                  {line.coreOwedCents > 0 && ` · core owed ${m(line.coreOwedCents)}`}
                </span>
              </th>
              <td className={cn('px-3 py-2 text-right align-top', wideOnly)}>{line.partCount}</td>
              <td className="px-3 py-2 text-right align-top whitespace-nowrap">
                {m(line.plannedCents)}
              </td>
              <td className={cn('px-3 py-2 text-right align-top whitespace-nowrap', wideOnly)}>
                {m(line.committedCents)}
              </td>
              <td className="px-3 py-2 text-right align-top whitespace-nowrap">
                {m(line.spentCents)}
              </td>
              <td className={cn('px-3 py-2 text-right align-top whitespace-nowrap', wideOnly)}>
                {m(line.coreOwedCents)}
              </td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
