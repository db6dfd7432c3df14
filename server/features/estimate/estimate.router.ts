import { Router } from 'express';
import { assumptionsInputSchema, estimateRequestSchema } from '@shared/schemas/estimate';
import type { AppDeps } from '@server/lib/deps';
import { createRateLimit } from '@server/middleware/rate-limit';
import { validate } from '@server/middleware/validate';
import * as service from './estimate.service';

/**
 * Stateless estimates per client per minute by default (ESTIMATE_RATE_LIMIT).
 * Generous: the page computes its what-if in the browser, so this only guards
 * the open endpoint from abuse.
 */
export const ESTIMATE_RATE_LIMIT = 120;

/** Mounted at /api/estimate: open without sign-in (the landing page's calculator). */
export function estimateRouter({ db, config }: AppDeps) {
  const router = Router();
  const limit = createRateLimit(db.knex, {
    prefix: `${config.rateLimitPrefix}estimate:`,
    limit: config.estimateRateLimit,
    windowMs: 60_000,
    message: 'Too many estimates from here. Wait a minute and try again.',
  });

  router.post('/', limit, validate({ body: estimateRequestSchema }), (req, res) => {
    res.json({ estimate: service.estimateStateless(req.body) });
  });
  return router;
}

/** Mounted at /api/builds/:buildId/estimate: the build's estimate, for every member. */
export function buildEstimateRouter(deps: AppDeps) {
  const router = Router({ mergeParams: true });
  router.get('/', deps.access('estimate:read'), async (req, res) => {
    const { buildId, role, build } = req.membership!;
    const viewer = role === 'shop' ? { shopUserId: req.user!.id } : {};
    res.json({ estimate: await service.estimateBuild(deps.db.knex, buildId, viewer, build) });
  });
  return router;
}

/** Mounted at /api/builds/:buildId/assumptions: read by members, changed by the owner. */
export function assumptionsRouter(deps: AppDeps) {
  const router = Router({ mergeParams: true });
  const knex = deps.db.knex;
  router.get('/', deps.access('estimate:read'), async (req, res) => {
    res.json(await service.getAssumptions(knex, req.membership!.buildId));
  });
  router.put(
    '/',
    deps.access('assumptions:update'),
    validate({ body: assumptionsInputSchema }),
    async (req, res) => {
      res.json(await service.saveAssumptions(knex, req.membership!.buildId, req.body));
    },
  );
  return router;
}
