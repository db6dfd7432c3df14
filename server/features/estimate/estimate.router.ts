import { Router } from 'express';
import { assumptionsInputSchema, estimateRequestSchema } from '../../../shared/schemas/estimate';
import type { AppDeps } from '../../app';
import { buildAccess } from '../../middleware/build-access';
import { createRateLimit } from '../../middleware/rate-limit';
import { validate } from '../../middleware/validate';
import * as service from './estimate.service';

/**
 * Stateless estimates per client per minute. Generous: the page computes its
 * what-if in the browser, so this only guards the open endpoint from abuse.
 */
export const ESTIMATE_RATE_LIMIT = 120;

/** Mounted at /api/estimate: open without sign-in (the landing page's calculator). */
export function estimateRouter({ db, config }: AppDeps) {
  const router = Router();
  const limit = createRateLimit(db.knex, {
    prefix: `${config.rateLimitPrefix}estimate:`,
    limit: ESTIMATE_RATE_LIMIT,
    windowMs: 60_000,
    message: 'Too many estimates from here. Wait a minute and try again.',
  });

  router.post('/', limit, validate({ body: estimateRequestSchema }), (req, res) => {
    res.json({ estimate: service.estimateStateless(req.body) });
  });
  return router;
}

/** Mounted at /api/builds/:buildId (estimate and assumptions). */
export function buildEstimateRouter({ db }: AppDeps) {
  const router = Router({ mergeParams: true });
  const knex = db.knex;

  router.get('/estimate', buildAccess(knex, 'estimate:read'), async (req, res) => {
    const { buildId, role } = req.membership!;
    const viewer = role === 'shop' ? { shopUserId: req.user!.id } : {};
    res.json({ estimate: await service.estimateBuild(knex, buildId, viewer) });
  });
  router.get('/assumptions', buildAccess(knex, 'estimate:read'), async (req, res) => {
    res.json(await service.getAssumptions(knex, req.membership!.buildId));
  });
  router.put(
    '/assumptions',
    buildAccess(knex, 'assumptions:update'),
    validate({ body: assumptionsInputSchema }),
    async (req, res) => {
      res.json(await service.saveAssumptions(knex, req.membership!.buildId, req.body));
    },
  );
  return router;
}
