import type { BuildView } from '@shared/schemas/sharing';
import { dateText, percent, powerText } from './view-text';

type View = BuildView;

/** The numbers a visitor wants first, as short cards. */
export function AtAGlance({ view }: { view: View }) {
  const cards: { label: string; value: string; note?: string }[] = [];
  if (view.summary) {
    cards.push({
      label: 'Target',
      value: powerText(view.summary.targetPowerHp, view.summary.targetPowerBasis),
      note: view.summary.targetDate ? `by ${dateText(view.summary.targetDate)}` : undefined,
    });
  }
  if (view.dyno?.vsTarget) {
    cards.push({
      label: 'Best on the dyno',
      value: powerText(view.dyno.vsTarget.achievedHp, view.dyno.vsTarget.basis),
      note: view.dyno.vsTarget.reached
        ? 'Target reached'
        : `${Math.min(99, Math.floor(view.dyno.vsTarget.progressPct))} % of the target`,
    });
  }
  if (view.estimate?.supported) {
    // In the target's basis, so the two cards compare at a glance.
    const basis = view.summary?.targetPowerBasis ?? 'crank';
    const { crankHp, wheelHp } = view.estimate.supported;
    cards.push({
      label: 'Parts support',
      value: powerText(basis === 'wheel' ? wheelHp : crankHp, basis),
      note: view.estimate.weakestLink ? `limited by ${view.estimate.weakestLink.name}` : undefined,
    });
  }
  if (view.parts && view.parts.total > 0) {
    const on = view.parts.byStatus.installed ?? 0;
    cards.push({
      label: 'On the truck',
      value: `${on} of ${view.parts.total} parts`,
      note: `${percent(on, view.parts.total)} % installed`,
    });
  }
  if (view.install && view.install.totals.steps > 0) {
    const t = view.install.totals;
    cards.push({
      label: 'Install',
      value: `${t.signedOff} of ${t.steps} steps`,
      note: 'signed off',
    });
  }
  if (cards.length === 0) return null;
  return (
    <ul aria-label="At a glance" className="grid grid-cols-2 gap-3 lg:grid-cols-5">
      {cards.map((c) => (
        <li key={c.label} className="rounded-lg border border-rule bg-sheet px-3 py-2.5">
          <p className="text-sm font-semibold tracking-wide text-muted uppercase">{c.label}</p>
          <p className="text-lg leading-snug font-bold break-words">{c.value}</p>
          {c.note && <p className="text-sm break-words text-ink-2">{c.note}</p>}
        </li>
      ))}
    </ul>
  );
}
