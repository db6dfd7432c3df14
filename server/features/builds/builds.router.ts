import { Router } from 'express';
import { createBuildInputSchema, updateBuildInputSchema } from '@shared/schemas/builds';
import type { AppDeps } from '@server/lib/deps';
import { requireAuth } from '@server/middleware/require-auth';
import { validate } from '@server/middleware/validate';
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
  router.get('/:buildId', deps.access('build:read'), async (req, res) => {
    const m = req.membership!;
    res.json({ build: await service.get(knex, m.buildId, req.user!.id, m) });
  });
  router.patch(
    '/:buildId',
    deps.access('build:update'),
    validate({ body: updateBuildInputSchema }),
    async (req, res) => {
      res.json({
        build: await service.update(knex, req.membership!.buildId, req.user!.id, req.body),
      });
    },
  );
  router.delete('/:buildId', deps.access('build:delete'), async (req, res) => {
    await service.remove(knex, req.membership!.buildId, deps);
    res.status(204).end();
  });
  return router;
}
