import {
  Activity,
  ClipboardList,
  Flag,
  Milestone,
  Package,
  Truck,
  type LucideIcon,
} from 'lucide-react';
import type { TimelineItemKind } from '@shared/schemas/timeline';

/** How each kind of dated item looks: its icon and its dot's colour on the track. */
export const kindLooks: Record<TimelineItemKind, { icon: LucideIcon; dot: string; label: string }> =
  {
    target: { icon: Flag, dot: 'bg-ink', label: 'Target date' },
    milestone: { icon: Milestone, dot: 'bg-accent-500', label: 'Milestone' },
    'part-expected': { icon: Package, dot: 'bg-[#3b6ea5]', label: 'Part expected' },
    'send-out-due': { icon: Truck, dot: 'bg-[#7a5aa6]', label: 'Due back from a shop' },
    job: { icon: ClipboardList, dot: 'bg-ok', label: 'Install job' },
    'dyno-session': { icon: Activity, dot: 'bg-ink-3', label: 'Dyno day' },
  };
