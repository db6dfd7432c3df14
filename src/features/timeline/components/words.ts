import { countdownLabel } from '@shared/format';
import type { ThreatRule, Timeline } from '@shared/schemas/timeline';

export const threatRuleLabels: Record<ThreatRule, string> = {
  'part-late': 'Part arriving late',
  'part-no-date': 'Part with no expected date',
  'send-out-overdue': 'Send-out overdue',
  'send-out-late': 'Send-out back late',
  'job-behind': 'Install job behind',
  'milestone-past-due': 'Milestone past due',
};

/** "5 days late", or "No date" when the miss cannot be counted. */
export function missLabel(days: number | null): string {
  if (days === null) return 'No date';
  return `${days} ${days === 1 ? 'day' : 'days'} late`;
}

/** "171 days to go" from the server's count, or null without a target. */
export function countdownOf(t: Timeline): string | null {
  return t.target.daysLeft === null ? null : countdownLabel(t.target.daysLeft);
}
