import type { PartStatus } from '@shared/schemas/parts';
import { cn } from '@/components/ui/cn';

/** The ledger's tones for a part's status, so a shared page reads like the ledger. */
const tones: Record<PartStatus, string> = {
  planned: 'border-dashed border-rule-strong bg-transparent text-ink-2',
  ordered: 'border-[#b9c3d6] bg-[#eef1f7] text-[#2c3a57]',
  'in-hand': 'border-accent-100 bg-accent-50 text-accent-700',
  'at-shop': 'border-tight/40 bg-tight-soft text-[#6b4408]',
  installed: 'border-ok/40 bg-ok-soft text-[#1d5434]',
  returned: 'border-rule bg-paper text-muted',
};

export function StatusChip({ status, label }: { status: PartStatus; label: string }) {
  return (
    <span
      className={cn(
        'inline-flex items-center rounded-md border px-2 py-0.5 text-sm font-semibold whitespace-nowrap print:border-ink/40 print:bg-transparent print:text-ink',
        tones[status],
      )}
    >
      {label}
    </span>
  );
}
