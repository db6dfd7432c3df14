import { CalendarDays } from 'lucide-react';
import { daysBetween, fallbackTimeZone, todayIn } from '@shared/dates';
import { countdownLabel } from '@shared/format';
import { Badge } from '@/components/ui/badge';

/**
 * How far away the target date is: "42 days to go", "Today", "3 days past" — counted from
 * today in the build's time zone, with the same function as the server's timeline.
 */
export function Countdown({
  date,
  timeZone,
  className,
}: {
  date: string | null;
  timeZone: string | null;
  className?: string;
}) {
  if (!date) return null;
  const days = daysBetween(todayIn(timeZone ?? fallbackTimeZone), date);
  if (Number.isNaN(days)) return null;
  const tone = days < 0 ? 'over' : days <= 14 ? 'tight' : 'neutral';
  return (
    <Badge tone={tone} className={className}>
      <CalendarDays aria-hidden className="size-3.5" />
      {countdownLabel(days)}
    </Badge>
  );
}
