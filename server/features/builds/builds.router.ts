import { Router } from 'express';
import { createBuildInputSchema, updateBuildInputSchema } from '../../../shared/schemas/builds';
import type { AppDeps } from '../../app';
import { buildAccess } from '../../middleware/build-access';
import { requireAuth } from '../../middleware/require-auth';
import { validate } from '../../middleware/validate';
import { buildEstimateRouter } from '../estimate/estimate.router';
import { membersRouter } from '../members/members.router';
import { partsRouter } from '../parts/parts.router';
import { installLogRouter } from '../install-log/install-log.router';
import { photosRouter } from '../photos/photos.router';
import * as service from './builds.service';

/** Mounted at /api/builds. */
export function buildsRouter(deps: AppDeps) {
  const router = Router();
  const knex = deps.db.knex;

  router.get('/', requireAuth, async (req, res) => {
    res.json({ builds: await service.listMine(knex, req.user!.id) });
  });
  router.post('/', requireAuth, validate({ body: createBuildInputSchema }), async (req, res) => {
    res.status(201).json({ build: await service.create(knex, req.user!.id, req.body) });
  });
  router.get('/:buildId', buildAccess(knex, 'build:read'), async (req, res) => {
    res.json({ build: await service.get(knex, req.membership!.buildId, req.user!.id) });
  });
  router.patch(
    '/:buildId',
    buildAccess(knex, 'build:update'),
    validate({ body: updateBuildInputSchema }),
    async (req, res) => {
      res.json({
        build: await service.update(knex, req.membership!.buildId, req.user!.id, req.body),
      });
    },
  );
  router.delete('/:buildId', buildAccess(knex, 'build:delete'), async (req, res) => {
    await service.remove(knex, req.membership!.buildId, deps);
    res.status(204).end();
  });

  router.use('/:buildId/members', membersRouter(deps));
  router.use('/:buildId', partsRouter(deps));
  router.use('/:buildId', installLogRouter(deps));
  router.use('/:buildId', photosRouter(deps));
  router.use('/:buildId', buildEstimateRouter(deps));
  return router;
}
