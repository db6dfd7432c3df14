import { CircleCheck, CircleHelp, CircleX, TriangleAlert } from 'lucide-react';
import { headroomStatusLabels, type HeadroomStatus } from '@shared/schemas/estimate';
import { Badge } from '@/components/ui/badge';

const icons = {
  over: CircleX,
  tight: TriangleAlert,
  ok: CircleCheck,
  unknown: CircleHelp,
};

/** A part's status in a word and an icon, never by colour alone. */
export function StatusBadge({ status }: { status: HeadroomStatus | 'unknown' }) {
  const Icon = icons[status];
  return (
    <Badge tone={status === 'unknown' ? 'neutral' : status}>
      <Icon aria-hidden className="size-4" />
      {status === 'unknown' ? 'Not rated — unknown' : headroomStatusLabels[status]}
    </Badge>
  );
}
