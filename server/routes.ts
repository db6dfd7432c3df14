/**
 * The API's URL tree, in one place: every router is mounted here once, under
 * /api, and its own routes are relative to that mount. A feature's URLs read
 * from this table; the fuzz test reads it too, so new routes are fuzzed.
 */
import type { Router } from 'express';
import type { AppDeps } from './lib/deps';
import { activityRouter } from './features/activity/activity.router';
import { emailChangesRouter, meRouter } from './features/auth/account.router';
import { authRouter } from './features/auth/auth.router';
import { benchSheetsRouter } from './features/bench/bench.router';
import { passwordResetRouter } from './features/auth/password-reset.router';
import { budgetRouter } from './features/budget/budget.router';
import { buildsRouter } from './features/builds/builds.router';
import { dynoRunsRouter, dynoSessionsRouter } from './features/dyno/dyno.router';
import {
  assumptionsRouter,
  buildEstimateRouter,
  estimateRouter,
} from './features/estimate/estimate.router';
import { healthRouter } from './features/health/health.router';
import {
  checklistRouter,
  fastenersRouter,
  jobsRouter,
  retorqueRouter,
  stepsRouter,
} from './features/install-log/install-log.router';
import {
  buildInvitationsRouter,
  invitationLinksRouter,
} from './features/invitations/invitations.router';
import { membersRouter } from './features/members/members.router';
import { noticePreferencesRouter } from './features/notices/notices.router';
import { partsCsvRouter, partsRouter } from './features/parts/parts.router';
import { photosRouter, subjectPhotosRouter } from './features/photos/photos.router';
import {
  buildSheetRouter,
  shareSettingsRouter,
  sharedRouter,
} from './features/sharing/sharing.router';
import {
  calendarFeedRouter,
  calendarFeedsRouter,
  milestonesRouter,
  timelineRouter,
} from './features/timeline/timeline.router';
import { wrenchesRouter } from './features/wrenches/wrenches.router';

/** `anonymous`: served before the session is read (no cookie lookup), e.g. the health check. */
export type Mount = { path: string; router: Router; anonymous?: boolean };

/** Every /api mount, relative to /api. A build's own data lives under /builds/:buildId/. */
export function apiRoutes(deps: AppDeps): Mount[] {
  const b = '/builds/:buildId';
  return [
    { path: '/health', router: healthRouter(deps), anonymous: true },
    // A shared build's public page: no session is read, nothing is writable.
    { path: '/shared', router: sharedRouter(deps), anonymous: true },
    // Phone calendars fetch a feed with its secret token and no session.
    { path: '/calendar-feeds', router: calendarFeedsRouter(deps), anonymous: true },
    { path: '/auth/password-reset', router: passwordResetRouter(deps) },
    { path: '/auth', router: authRouter(deps) },
    { path: '/me/wrenches', router: wrenchesRouter(deps) },
    { path: '/me', router: meRouter(deps) },
    { path: '/email-changes', router: emailChangesRouter(deps) },
    { path: '/estimate', router: estimateRouter(deps) },
    { path: '/invitations', router: invitationLinksRouter(deps) },
    { path: '/builds', router: buildsRouter(deps) },
    { path: `${b}/members`, router: membersRouter(deps) },
    { path: `${b}/invitations`, router: buildInvitationsRouter(deps) },
    { path: `${b}/notice-preferences`, router: noticePreferencesRouter(deps) },
    { path: `${b}/activity`, router: activityRouter(deps) },
    { path: `${b}/parts.csv`, router: partsCsvRouter(deps) },
    { path: `${b}/parts/:partId/photos`, router: subjectPhotosRouter(deps, 'partId') },
    { path: `${b}/parts`, router: partsRouter(deps) },
    { path: `${b}/budget`, router: budgetRouter(deps) },
    { path: `${b}/estimate`, router: buildEstimateRouter(deps) },
    { path: `${b}/assumptions`, router: assumptionsRouter(deps) },
    { path: `${b}/jobs`, router: jobsRouter(deps) },
    { path: `${b}/steps/:stepId/photos`, router: subjectPhotosRouter(deps, 'stepId') },
    { path: `${b}/steps`, router: stepsRouter(deps) },
    { path: `${b}/checklist`, router: checklistRouter(deps) },
    { path: `${b}/fasteners`, router: fastenersRouter(deps) },
    { path: `${b}/retorque-checks`, router: retorqueRouter(deps) },
    { path: `${b}/photos`, router: photosRouter(deps) },
    { path: `${b}/bench-sheets`, router: benchSheetsRouter(deps) },
    { path: `${b}/dyno-sessions`, router: dynoSessionsRouter(deps) },
    { path: `${b}/dyno-runs`, router: dynoRunsRouter(deps) },
    { path: `${b}/share`, router: shareSettingsRouter(deps) },
    { path: `${b}/sheet`, router: buildSheetRouter(deps) },
    { path: `${b}/timeline`, router: timelineRouter(deps) },
    { path: `${b}/milestones`, router: milestonesRouter(deps) },
    { path: `${b}/calendar-feed`, router: calendarFeedRouter(deps) },
  ];
}

export type RouteInfo = { method: string; path: string };

/** Every route under the mounts, as `METHOD /api/…` with Express path parameters. */
export function listRoutes(mounts: Mount[]): RouteInfo[] {
  const out: RouteInfo[] = [];
  for (const { path, router } of mounts) {
    const stack = (router as unknown as { stack: { route?: { path: string; methods: object } }[] })
      .stack;
    for (const layer of stack) {
      if (!layer.route) continue;
      for (const method of Object.keys(layer.route.methods)) {
        const sub = layer.route.path === '/' ? '' : layer.route.path;
        out.push({ method: method.toUpperCase(), path: `/api${path}${sub}` });
      }
    }
  }
  return out;
}
