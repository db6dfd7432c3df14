import { CircleCheck, CircleDashed, Wrench } from 'lucide-react';
import { stepStatusLabels, type StepStatus } from '../../../../shared/schemas/install-log';
import { Badge } from '../../../components/ui/badge';

const tones = { 'not-started': 'neutral', 'under-way': 'accent', 'signed-off': 'ok' } as const;
const icons = { 'not-started': CircleDashed, 'under-way': Wrench, 'signed-off': CircleCheck };

export function StepStatusBadge({ status }: { status: StepStatus }) {
  const Icon = icons[status];
  return (
    <Badge tone={tones[status]}>
      <Icon aria-hidden className="size-4" />
      {stepStatusLabels[status]}
    </Badge>
  );
}
