import { Router } from 'express';
import type { AppDeps } from '@server/lib/deps';
import * as service from './budget.service';

/** Mounted at /api/builds/:buildId/budget (owner only: it is all money). */
export function budgetRouter(deps: AppDeps) {
  const router = Router({ mergeParams: true });
  router.get('/', deps.access('budget:read'), async (req, res) => {
    const m = req.membership!;
    res.json({ budget: await service.get(deps.db.knex, m.buildId, req.user!.id, m) });
  });
  return router;
}
