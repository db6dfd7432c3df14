import { CircleCheck, CircleHelp, TriangleAlert } from 'lucide-react';
import type { SheetStatus } from '@shared/schemas/bench';
import { Badge } from '@/components/ui/badge';
import { sheetStatusLabels } from '../lib/format';

/** A sheet's verdict at a glance; the icon and the words carry it, not only the colour. */
export function SheetStatusBadge({ status }: { status: SheetStatus }) {
  if (status === 'in-tolerance')
    return (
      <Badge tone="ok">
        <CircleCheck aria-hidden className="size-4" />
        {sheetStatusLabels[status]}
      </Badge>
    );
  if (status === 'out-of-tolerance')
    return (
      <Badge tone="over">
        <TriangleAlert aria-hidden className="size-4" />
        {sheetStatusLabels[status]}
      </Badge>
    );
  return (
    <Badge tone="neutral">
      <CircleHelp aria-hidden className="size-4" />
      {sheetStatusLabels[status]}
    </Badge>
  );
}
