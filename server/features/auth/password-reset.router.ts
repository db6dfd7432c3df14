import { Router } from 'express';
import {
  completePasswordResetInputSchema,
  passwordResetRequestedMessage,
  requestPasswordResetInputSchema,
} from '@shared/schemas/password-reset';
import type { AppDeps } from '@server/lib/deps';
import { authLimits, createRateLimit } from '@server/middleware/rate-limit';
import { validate } from '@server/middleware/validate';
import * as service from './password-reset.service';

/** Mounted at /api/auth/password-reset. */
export function passwordResetRouter({ db, config, sessions }: AppDeps) {
  const router = Router();
  const knex = db.knex;
  const requestLimit = createRateLimit(knex, {
    prefix: `${config.rateLimitPrefix}password-reset:`,
    limit: config.passwordResetRateLimit,
    windowMs: 15 * 60_000,
    message: 'Too many password-reset requests from here. Wait 15 minutes and try again.',
  });
  // Choosing the new password: failed attempts on a counter of its own.
  const authLimit = authLimits(knex, config, 'reset-complete');

  router.post(
    '/',
    requestLimit,
    validate({ body: requestPasswordResetInputSchema }),
    async (req, res) => {
      await service.request(knex, req.body.email);
      res.status(202).json({ message: passwordResetRequestedMessage });
    },
  );
  router.get('/:token', async (req, res) => {
    res.json({ reset: await service.check(knex, String(req.params.token)) });
  });
  router.post(
    '/:token',
    ...authLimit,
    validate({ body: completePasswordResetInputSchema }),
    async (req, res) => {
      const user = await service.complete(knex, String(req.params.token), req.body.password);
      // Every session of the account ends (a thief's too); this browser signs in afresh.
      await sessions.endAllFor(user.id);
      await sessions.start(req, res, user.id);
      res.json({ user });
    },
  );
  return router;
}
