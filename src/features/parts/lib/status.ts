import { stampStatusDates } from '@shared/ledger/status-dates';
import {
  partStatusLabels,
  type Part,
  type PartStatus,
  type UpdatePartInput,
} from '@shared/schemas/parts';

/**
 * Each status has its own look: a tone and an icon, so color is never the only cue.
 * Planned is an outline (nothing has happened yet); ordered, in the garage and out at a
 * shop are calm colors of their own (blue, teal, violet), never the brand orange or the
 * amber and red that mean a warning; installed is the green of done. Warnings about a part
 * (overdue at the shop) are drawn apart, in the warning colors.
 */
export const statusTone: Record<PartStatus, string> = {
  planned: 'border-dashed border-rule-strong bg-transparent text-ink-2',
  ordered: 'border-state-blue-line bg-state-blue-soft text-state-blue',
  'in-hand': 'border-state-teal-line bg-state-teal-soft text-state-teal',
  'at-shop': 'border-state-violet-line bg-state-violet-soft text-state-violet',
  installed: 'border-ok/40 bg-ok-soft text-[#1d5434]',
  returned: 'border-rule bg-paper text-muted',
};

export function statusLabel(status: PartStatus): string {
  return partStatusLabels[status];
}

/**
 * What to send when a part's status is changed from its row: the status, plus the build's today (its time
 * zone's date, buildToday) where the shared rule stamps one (ordered, received, sent out, installed;
 * back from the shop when it leaves one). The server applies the same rule to what it is sent,
 * so the dates sent here are the ones kept.
 */
export function statusChange(part: Part, status: PartStatus, today: string): UpdatePartInput {
  return stampStatusDates(part, { status }, today);
}
