import { Router } from 'express';
import {
  createMilestoneInputSchema,
  timelineSettingsInputSchema,
  updateMilestoneInputSchema,
} from '@shared/schemas/timeline';
import type { AppDeps } from '@server/lib/deps';
import { weakEtag } from '@server/lib/etag';
import { param, scoped } from '@server/lib/scope';
import { validate } from '@server/middleware/validate';
import * as calendar from './calendar.service';
import * as milestones from './milestones.service';
import * as timeline from './timeline.service';

/** Mounted at /api/builds/:buildId/timeline. */
export function timelineRouter({ db: { knex }, access }: AppDeps) {
  const router = Router({ mergeParams: true });
  router.get(
    '/',
    access('timeline:read'),
    scoped(knex, async (s) => ({ timeline: await timeline.getTimeline(s) })),
  );
  router.patch(
    '/settings',
    access('timeline:settings'),
    validate({ body: timelineSettingsInputSchema }),
    scoped(knex, async (s, req) => ({ timeline: await timeline.updateSettings(s, req.body) })),
  );
  return router;
}

/** Mounted at /api/builds/:buildId/milestones. */
export function milestonesRouter({ db: { knex }, access }: AppDeps) {
  const router = Router({ mergeParams: true });
  const id = (req: Parameters<typeof param>[0]) => param(req, 'milestoneId');
  router.get(
    '/',
    access('milestones:read'),
    scoped(knex, async (s) => ({ milestones: await milestones.list(s) })),
  );
  router.post(
    '/',
    access('milestones:write'),
    validate({ body: createMilestoneInputSchema }),
    scoped(knex, async (s, req) => ({ milestone: await milestones.create(s, req.body) }), 201),
  );
  router.patch(
    '/:milestoneId',
    access('milestones:write'),
    validate({ body: updateMilestoneInputSchema }),
    scoped(knex, async (s, req) => ({ milestone: await milestones.update(s, id(req), req.body) })),
  );
  router.delete(
    '/:milestoneId',
    access('milestones:write'),
    scoped(knex, (s, req) => milestones.remove(s, id(req))),
  );
  return router;
}

/** Mounted at /api/builds/:buildId/calendar-feed: the caller's own feed link. */
export function calendarFeedRouter({ db: { knex }, access, config }: AppDeps) {
  const router = Router({ mergeParams: true });
  const own = access('calendar:own-feed');
  router.get(
    '/',
    own,
    scoped(knex, async (s) => ({ feed: await calendar.getFeed(s) })),
  );
  router.post(
    '/',
    own,
    scoped(knex, async (s) => ({ feed: await calendar.makeFeed(s, config.appUrl) }), 201),
  );
  router.delete(
    '/',
    own,
    scoped(knex, (s) => calendar.stopFeed(s)),
  );
  return router;
}

/** Mounted at /api/calendar-feeds, before sessions: calendars fetch with the token alone. */
export function calendarFeedsRouter({ db: { knex }, config }: AppDeps) {
  const router = Router();
  router.get('/:token/calendar.ics', async (req, res) => {
    const ics = await calendar.renderFeed(knex, param(req, 'token'), config.appUrl);
    // Calendar apps poll the feed; a matching If-None-Match answers 304.
    res.type('text/calendar; charset=utf-8').set('ETag', weakEtag(ics)).send(ics);
  });
  return router;
}
