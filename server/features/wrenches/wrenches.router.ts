import { Router } from 'express';
import { createWrenchInputSchema, updateWrenchInputSchema } from '@shared/schemas/wrenches';
import type { AppDeps } from '@server/lib/deps';
import { requireAuth } from '@server/middleware/require-auth';
import { validate } from '@server/middleware/validate';
import * as service from './wrenches.service';

/** Mounted at /api/me/wrenches: the signed-in person's own torque wrenches. */
export function wrenchesRouter({ db }: AppDeps) {
  const router = Router();
  const knex = db.knex;
  router.use(requireAuth);
  router.get('/', async (req, res) => {
    res.json({ wrenches: await service.list(knex, req.user!.id) });
  });
  router.post('/', validate({ body: createWrenchInputSchema }), async (req, res) => {
    res.status(201).json({ wrench: await service.create(knex, req.user!.id, req.body) });
  });
  router.patch('/:wrenchId', validate({ body: updateWrenchInputSchema }), async (req, res) => {
    res.json({
      wrench: await service.update(knex, req.user!.id, String(req.params.wrenchId), req.body),
    });
  });
  router.delete('/:wrenchId', async (req, res) => {
    await service.remove(knex, req.user!.id, String(req.params.wrenchId));
    res.status(204).end();
  });
  return router;
}
