import { roleLabels, type Role } from '@shared/permissions';
import { Badge } from './badge';

export function RoleBadge({ role, prefix }: { role: Role; prefix?: string }) {
  return (
    <Badge tone={role === 'owner' ? 'accent' : 'neutral'}>
      {prefix}
      {roleLabels[role] ?? role}
    </Badge>
  );
}
