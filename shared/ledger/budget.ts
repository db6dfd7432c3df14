import type { Budget, BudgetLine, PartCategory, PartStatus } from '@shared/schemas/parts';
import { coreOwedCents, partTotalCents, type PartMoney } from './cost';

/** What the budget reads of a part: its money, stage and the dates it is ordered by. */
export type BudgetPart = PartMoney & {
  id: string;
  name: string;
  category: PartCategory;
  status: PartStatus;
  orderedOn: string | null;
  receivedOn: string | null;
  createdAt: string;
};

/** Money is committed once a part is ordered, and spent once it is in hand. */
const committedStatuses: ReadonlySet<PartStatus> = new Set([
  'ordered',
  'in-hand',
  'at-shop',
  'installed',
]);
const spentStatuses: ReadonlySet<PartStatus> = new Set(['in-hand', 'at-shop', 'installed']);
const stageRank = (s: PartStatus) => (spentStatuses.has(s) ? 0 : committedStatuses.has(s) ? 1 : 2);

function emptyLine(): Omit<BudgetLine, 'category'> {
  return { plannedCents: 0, committedCents: 0, spentCents: 0, coreOwedCents: 0, partCount: 0 };
}

/**
 * The budget summary of a build. Planned counts every part not sent back;
 * committed, the parts ordered or further along; spent, those in hand or further.
 * Core charges not yet refunded are reported separately as money owed back.
 */
export function computeBudget(parts: BudgetPart[], budgetCents: number, currency: string): Budget {
  const live = parts.filter((p) => p.status !== 'returned');
  const lines = new Map<PartCategory, BudgetLine>();
  const totals = emptyLine();
  for (const p of live) {
    const cost = partTotalCents(p);
    const line = lines.get(p.category) ?? { category: p.category, ...emptyLine() };
    for (const target of [line, totals]) {
      target.plannedCents += cost;
      if (committedStatuses.has(p.status)) target.committedCents += cost;
      if (spentStatuses.has(p.status)) target.spentCents += cost;
      target.coreOwedCents += coreOwedCents(p);
      target.partCount += 1;
    }
    lines.set(p.category, line);
  }

  // Money goes out in this order: spent first, then committed, then planned,
  // each by date. The part that crosses the budget line is the one to question.
  const dateOf = (p: BudgetPart) => p.orderedOn ?? p.receivedOn ?? p.createdAt.slice(0, 10);
  const ordered = [...live].sort(
    (a, b) =>
      stageRank(a.status) - stageRank(b.status) ||
      dateOf(a).localeCompare(dateOf(b)) ||
      a.createdAt.localeCompare(b.createdAt),
  );
  // A budget of zero means none was set: nothing can be over it.
  const hasBudget = budgetCents > 0;
  let running = 0;
  let tippingPart: Budget['tippingPart'] = null;
  for (const p of hasBudget ? ordered : []) {
    running += partTotalCents(p);
    if (running > budgetCents) {
      tippingPart = { id: p.id, name: p.name, overByCents: totals.plannedCents - budgetCents };
      break;
    }
  }

  const byDate = new Map<string, { committed: number; spent: number }>();
  for (const p of live.filter((x) => committedStatuses.has(x.status))) {
    const d = dateOf(p);
    const entry = byDate.get(d) ?? { committed: 0, spent: 0 };
    entry.committed += partTotalCents(p);
    if (spentStatuses.has(p.status)) entry.spent += partTotalCents(p);
    byDate.set(d, entry);
  }
  let c = 0;
  let s = 0;
  const spendingOverTime = [...byDate.keys()].sort().map((date) => {
    c += byDate.get(date)!.committed;
    s += byDate.get(date)!.spent;
    return { date, committedCents: c, spentCents: s };
  });

  return {
    currency,
    budgetCents,
    totals,
    categories: [...lines.values()].sort((a, b) => b.plannedCents - a.plannedCents),
    remainingAfterPlannedCents: budgetCents - totals.plannedCents,
    remainingAfterSpentCents: budgetCents - totals.spentCents,
    overBudget: hasBudget && totals.plannedCents > budgetCents,
    tippingPart,
    spendingOverTime,
  };
}
