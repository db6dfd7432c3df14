import { CircleCheck, CircleDashed, ShieldAlert, Wrench } from 'lucide-react';
import { stepStatusLabels, type StepStatus } from '@shared/schemas/install-log';
import { Badge } from '@/components/ui/badge';

// Under way is work in progress, not a warning: a quiet blue, not the brand orange.
const tones = { 'not-started': 'neutral', 'under-way': 'info', 'signed-off': 'ok' } as const;
const icons = { 'not-started': CircleDashed, 'under-way': Wrench, 'signed-off': CircleCheck };

/** Words for a step signed off over open items (the owner's override). */
export const overriddenLabel = 'Signed off over open items';

/**
 * A step's status. A step the owner signed off over open items (missing or out-of-spec
 * readings, unticked checks) is not a clean sign-off and does not look like one.
 */
export function StepStatusBadge({
  status,
  overridden = false,
}: {
  status: StepStatus;
  overridden?: boolean;
}) {
  if (status === 'signed-off' && overridden) {
    return (
      <Badge tone="tight">
        <ShieldAlert aria-hidden className="size-4" />
        {overriddenLabel}
      </Badge>
    );
  }
  const Icon = icons[status];
  return (
    <Badge tone={tones[status]}>
      <Icon aria-hidden className="size-4" />
      {stepStatusLabels[status]}
    </Badge>
  );
}
