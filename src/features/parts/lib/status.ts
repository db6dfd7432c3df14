import {
  partConsistencyIssues,
  partStatusLabels,
  type Part,
  type PartStatus,
  type UpdatePartInput,
} from '../../../../shared/schemas/parts';

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

/** The date a status change records, when that date is still empty. */
const dateFor: Partial<Record<PartStatus, keyof Part & keyof UpdatePartInput>> = {
  ordered: 'orderedOn',
  'in-hand': 'receivedOn',
  'at-shop': 'sentOutOn',
  installed: 'installedOn',
};

export function todayIso(now: Date = new Date()): string {
  const y = now.getFullYear();
  const m = String(now.getMonth() + 1).padStart(2, '0');
  const d = String(now.getDate()).padStart(2, '0');
  return `${y}-${m}-${d}`;
}

/**
 * What to send when a part's status is changed from its row: the status, plus today's date
 * in the matching empty date field (ordered, received, sent out, installed; back from the
 * shop when it leaves one). A date is only added when it keeps the part's dates in order,
 * so a quick status change never fails on a date the user did not type.
 */
export function statusChange(part: Part, status: PartStatus, today = todayIso()): UpdatePartInput {
  const patch: UpdatePartInput = { status };
  const field = dateFor[status];
  if (field && !part[field]) Object.assign(patch, { [field]: today });
  if (part.status === 'at-shop' && status !== 'at-shop' && part.sentOutOn && !part.backOn) {
    patch.backOn = today;
  }
  const merged = { ...part, ...patch };
  const issues = partConsistencyIssues({
    orderedOn: merged.orderedOn,
    expectedOn: merged.expectedOn,
    receivedOn: merged.receivedOn,
    sentOutOn: merged.sentOutOn,
    backOn: merged.backOn,
    installedOn: merged.installedOn,
  });
  for (const key of Object.keys(issues)) {
    if (key in patch && key !== 'status') delete patch[key as keyof UpdatePartInput];
  }
  return patch;
}
