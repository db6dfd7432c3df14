/**
 * Calendar feeds: each member's secret link to the build's dates, for a phone
 * calendar to subscribe to. The token (256 random bits) is shown once, when the
 * link is made, and only its SHA-256 is kept; making a new link replaces the old
 * one, which then answers 404, as does any wrong token or the link of someone no
 * longer on the build. The feed shows what the member's current role shows.
 */
import type { Knex } from 'knex';
import { NotFoundError } from '@server/lib/errors';
import type { BuildScope } from '@server/lib/scope';
import { hashToken, isTokenShaped, newToken } from '@server/lib/tokens';
import { findRole } from '@server/features/members';
import { feedIcs } from './calendar.ics';
import * as repo from './calendar.repository';
import { loadTimeline } from './timeline.service';

/** The feed's address. The token ends a path segment, so the logs' redaction hides it. */
export function feedUrl(appUrl: string, token: string) {
  return `${appUrl}/api/calendar-feeds/${token}/calendar.ics`;
}

export async function getFeed({ knex, buildId, caller }: BuildScope) {
  return (await repo.findFeed(knex, buildId, caller.userId)) ?? null;
}

/** A new link for the caller; any earlier one stops working at once. */
export async function makeFeed({ knex, buildId, caller }: BuildScope, appUrl: string) {
  const { token, hash } = newToken();
  const { createdAt } = await repo.replaceFeed(knex, buildId, caller.userId, hash);
  const url = feedUrl(appUrl, token);
  return { createdAt, url, webcalUrl: url.replace(/^https?:/, 'webcal:') };
}

export async function stopFeed({ knex, buildId, caller }: BuildScope) {
  await repo.deleteFeed(knex, buildId, caller.userId);
}

/** The iCalendar text a token opens, or 404. */
export async function renderFeed(knex: Knex, token: string, appUrl: string, now = new Date()) {
  const notFound = new NotFoundError('No such calendar');
  if (!isTokenShaped(token)) throw notFound;
  const feed = await repo.findByTokenHash(knex, hashToken(token));
  const role = feed && (await findRole(knex, feed.buildId, feed.userId));
  if (!feed || !role) throw notFound;
  const scope: BuildScope = { knex, buildId: feed.buildId, caller: { userId: feed.userId, role } };
  const { build, timeline } = await loadTimeline(scope, now);
  return feedIcs({ buildId: feed.buildId, buildName: build.name, timeline, appUrl });
}
