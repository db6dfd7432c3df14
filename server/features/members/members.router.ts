import { Router } from 'express';
import { updateMemberInputSchema } from '@shared/schemas/builds';
import type { AppDeps } from '@server/lib/deps';
import { validate } from '@server/middleware/validate';
import * as service from './members.service';

/**
 * Mounted at /api/builds/:buildId/members. People join only through an invitation
 * (/invitations): adding an existing account by its address here would tell the owner
 * which addresses have Headroom accounts.
 */
export function membersRouter(deps: AppDeps) {
  const { db } = deps;
  const router = Router({ mergeParams: true });
  const knex = db.knex;

  router.get('/', deps.access('members:read'), async (req, res) => {
    res.json({ members: await service.list(knex, req.membership!.buildId, req.membership!.role) });
  });
  router.patch(
    '/:userId',
    deps.access('members:manage'),
    validate({ body: updateMemberInputSchema }),
    async (req, res) => {
      res.json({
        member: await service.changeRole(
          knex,
          req.membership!.buildId,
          String(req.params.userId),
          req.body,
        ),
      });
    },
  );
  router.delete('/:userId', deps.access('members:manage'), async (req, res) => {
    await service.remove(knex, req.membership!.buildId, String(req.params.userId));
    res.status(204).end();
  });

  return router;
}
