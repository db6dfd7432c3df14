import { Router } from 'express';
import {
  acceptInvitationInputSchema,
  createInvitationInputSchema,
} from '@shared/schemas/invitations';
import type { AppDeps } from '@server/lib/deps';
import { authLimits } from '@server/middleware/rate-limit';
import { validate } from '@server/middleware/validate';
import * as service from './invitations.service';

/** Mounted at /api/builds/:buildId/invitations: the owner's side. */
export function buildInvitationsRouter(deps: AppDeps) {
  const { db } = deps;
  const router = Router({ mergeParams: true });
  const knex = db.knex;
  const manage = deps.access('invitations:manage');

  router.get('/', manage, async (req, res) => {
    res.json({ invitations: await service.list(knex, req.membership!.buildId) });
  });
  router.post('/', manage, validate({ body: createInvitationInputSchema }), async (req, res) => {
    res.status(201).json({
      invitation: await service.create(
        knex,
        req.membership!.buildId,
        req.user!,
        req.body,
        deps.config.invitationLimits,
      ),
    });
  });
  router.post('/:invitationId/resend', manage, async (req, res) => {
    res.json({
      invitation: await service.resend(
        knex,
        req.membership!.buildId,
        String(req.params.invitationId),
        req.user!,
        deps.config.invitationLimits,
      ),
    });
  });
  router.delete('/:invitationId', manage, async (req, res) => {
    await service.revoke(knex, req.membership!.buildId, String(req.params.invitationId));
    res.status(204).end();
  });
  return router;
}

/** Mounted at /api/invitations: the invited person's side, reached by the link's token. */
export function invitationLinksRouter({ db, config, sessions }: AppDeps) {
  const router = Router();
  const knex = db.knex;
  // Accepting may create an account: failed attempts on a counter of its own.
  const limit = authLimits(knex, config, 'invitation-accept');

  router.get('/:token', async (req, res) => {
    res.json({ invitation: await service.preview(knex, String(req.params.token)) });
  });
  router.post(
    '/:token/accept',
    ...limit,
    validate({ body: acceptInvitationInputSchema }),
    async (req, res) => {
      const result = await service.accept(knex, String(req.params.token), req.user, req.body);
      if (result.accountCreated) await sessions.replace(req, res, result.user.id);
      res.status(result.accountCreated ? 201 : 200).json(result);
    },
  );
  return router;
}
