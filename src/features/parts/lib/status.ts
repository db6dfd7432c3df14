import { stampStatusDates } from '../../../../shared/ledger/status-dates';
import {
  partStatusLabels,
  type Part,
  type PartStatus,
  type UpdatePartInput,
} from '../../../../shared/schemas/parts';

/**
 * Each status has its own look: a tone and an icon name, so colour is never the only cue.
 * Planned is an outline (nothing has happened yet), then the part gathers ink as it
 * moves toward the truck; a part away at a shop is amber because someone else has it.
 */
export const statusTone: Record<PartStatus, string> = {
  planned: 'border-dashed border-rule-strong bg-transparent text-ink-2',
  ordered: 'border-[#b9c3d6] bg-[#eef1f7] text-[#2c3a57]',
  'in-hand': 'border-accent-100 bg-accent-50 text-accent-700',
  'at-shop': 'border-tight/40 bg-tight-soft text-[#6b4408]',
  installed: 'border-ok/40 bg-ok-soft text-[#1d5434]',
  returned: 'border-rule bg-paper text-muted',
};

export function statusLabel(status: PartStatus): string {
  return partStatusLabels[status];
}

export function todayIso(now: Date = new Date()): string {
  const y = now.getFullYear();
  const m = String(now.getMonth() + 1).padStart(2, '0');
  const d = String(now.getDate()).padStart(2, '0');
  return `${y}-${m}-${d}`;
}

/**
 * What to send when a part's status is changed from its row: the status, plus today's date (the
 * browser's own day) where the shared rule stamps one (ordered, received, sent out, installed;
 * back from the shop when it leaves one). The server applies the same rule to what it is sent,
 * so the dates sent here are the ones kept.
 */
export function statusChange(part: Part, status: PartStatus, today = todayIso()): UpdatePartInput {
  return stampStatusDates(part, { status }, today);
}
