import {
  CircleCheckBig,
  ClipboardList,
  PackageCheck,
  Truck,
  Undo2,
  Wrench,
  type LucideIcon,
} from 'lucide-react';
import type { PartStatus } from '@shared/schemas/parts';
import { cn } from '@/components/ui/cn';
import { statusLabel, statusTone } from '../lib/status';

export const statusIcon: Record<PartStatus, LucideIcon> = {
  planned: ClipboardList,
  ordered: Truck,
  'in-hand': PackageCheck,
  'at-shop': Wrench,
  installed: CircleCheckBig,
  returned: Undo2,
};

/** A part's status for roles that cannot change it. */
export function StatusBadge({ status, className }: { status: PartStatus; className?: string }) {
  const Icon = statusIcon[status];
  return (
    <span
      className={cn(
        'inline-flex items-center gap-1.5 rounded-md border px-2 py-0.5 text-sm font-semibold whitespace-nowrap',
        statusTone[status],
        className,
      )}
    >
      <Icon aria-hidden className="size-4 shrink-0" />
      {statusLabel(status)}
    </span>
  );
}
