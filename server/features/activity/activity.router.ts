import { Router } from 'express';
import type { AppDeps } from '@server/lib/deps';
import { scoped } from '@server/lib/scope';
import * as builds from '@server/features/builds';
import * as service from './activity.service';

/** Mounted at /api/builds/:buildId/activity: what has happened lately, as the caller may see it. */
export function activityRouter(deps: AppDeps) {
  const router = Router({ mergeParams: true });
  router.get(
    '/',
    deps.access('activity:read'),
    scoped(deps.db.knex, async (s) => ({
      events: await service.recentActivity(s, await builds.calendar(s.knex, s.buildId)),
    })),
  );
  return router;
}
