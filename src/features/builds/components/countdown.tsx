import { CalendarDays } from 'lucide-react';
import { countdownLabel, daysUntil } from '../../../../shared/format';
import { Badge } from '../../../components/ui/badge';

/** How far away the target date is: "42 days to go", "Today", "3 days past". */
export function Countdown({ date, className }: { date: string | null; className?: string }) {
  if (!date) return null;
  const days = daysUntil(date);
  if (days === null) return null;
  const tone = days < 0 ? 'over' : days <= 14 ? 'tight' : 'neutral';
  return (
    <Badge tone={tone} className={className}>
      <CalendarDays aria-hidden className="size-3.5" />
      {countdownLabel(days)}
    </Badge>
  );
}
