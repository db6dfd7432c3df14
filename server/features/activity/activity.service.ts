/**
 * A build's recent activity, for every member: the newest events of each kind merged,
 * newest first. A shop gets only what concerns its own parts (the parts, the steps that
 * use them, their photos, its own bench sheets); no event carries money for anyone.
 */
import { activityLimit, type ActivityEvent } from '@shared/schemas/activity';
import type { BuildScope } from '@server/lib/scope';
import * as repo from './activity.repository';

/** Newest first: by day, then by the moment where known (a dated part event ends its day). */
function newestFirst(a: ActivityEvent, b: ActivityEvent) {
  if (a.day !== b.day) return a.day < b.day ? 1 : -1;
  return (b.at ?? '').localeCompare(a.at ?? '');
}

/** `calendar`: the build's time zone and its today there (events are dated by that zone). */
export async function recentActivity(
  { knex, buildId, caller }: BuildScope,
  calendar: { timeZone: string; today: string },
) {
  const filter = {
    buildId,
    shopUserId: caller.role === 'shop' ? caller.userId : undefined,
    ...calendar,
    limit: activityLimit,
  };
  // One statement after another: few rows each, and no transaction to share.
  const events = [
    ...(await repo.partEvents(knex, filter)),
    ...(await repo.signOffEvents(knex, filter)),
    ...(await repo.photoEvents(knex, filter)),
    ...(await repo.benchEvents(knex, filter)),
  ];
  return events.sort(newestFirst).slice(0, activityLimit);
}
