import { Router } from 'express';
import type { AppDeps } from '../../lib/deps';
import * as service from './budget.service';

/** Mounted at /api/builds/:buildId/budget (owner only: it is all money). */
export function budgetRouter(deps: AppDeps) {
  const router = Router({ mergeParams: true });
  router.get('/', deps.access('budget:read'), async (req, res) => {
    res.json({ budget: await service.get(deps.db.knex, req.membership!.buildId, req.user!.id) });
  });
  return router;
}
