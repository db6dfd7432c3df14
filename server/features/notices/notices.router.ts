import { Router } from 'express';
import { noticePreferencesInputSchema } from '@shared/schemas/notices';
import type { AppDeps } from '@server/lib/deps';
import { validate } from '@server/middleware/validate';
import * as service from './notices.service';

/** Mounted at /api/builds/:buildId/notice-preferences: each member's own choices. */
export function noticePreferencesRouter(deps: AppDeps) {
  const { db } = deps;
  const router = Router({ mergeParams: true });
  const knex = db.knex;
  const own = deps.access('notices:own-preferences');

  router.get('/', own, async (req, res) => {
    res.json({
      preferences: await service.getPreferences(knex, req.membership!.buildId, req.user!.id),
    });
  });
  router.put('/', own, validate({ body: noticePreferencesInputSchema }), async (req, res) => {
    res.json({
      preferences: await service.setPreferences(
        knex,
        req.membership!.buildId,
        req.user!.id,
        req.body,
      ),
    });
  });
  return router;
}
