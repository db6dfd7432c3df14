import { Router } from 'express';
import {
  changeEmailInputSchema,
  changePasswordInputSchema,
  emailChangeRequestedMessage,
  updateProfileInputSchema,
} from '@shared/schemas/account';
import type { AppDeps } from '@server/lib/deps';
import { requireAuth } from '@server/middleware/require-auth';
import { createRateLimit } from '@server/middleware/rate-limit';
import { validate } from '@server/middleware/validate';
import * as service from './account.service';

/**
 * Mounted at /api/me: who I am, and my own name, e-mail and password. Wrong current
 * passwords count per account (ACCOUNT_RATE_LIMIT per 15 minutes), like failed sign-ins.
 */
export function meRouter({ db, config, sessions }: AppDeps) {
  const router = Router();
  const knex = db.knex;
  const passwordChecks = createRateLimit(knex, {
    prefix: `${config.rateLimitPrefix}account-password:`,
    limit: config.accountRateLimit,
    windowMs: 15 * 60_000,
    message: 'Too many wrong passwords. Wait 15 minutes and try again.',
    failuresOnly: true,
    key: (req) => req.user?.id ?? '-',
  });

  router.get('/', requireAuth, (req, res) => {
    res.json({ user: req.user });
  });
  router.patch('/', requireAuth, validate({ body: updateProfileInputSchema }), async (req, res) => {
    res.json({ user: await service.updateProfile(knex, req.user!.id, req.body) });
  });
  router.post(
    '/email',
    requireAuth,
    passwordChecks,
    validate({ body: changeEmailInputSchema }),
    async (req, res) => {
      await service.requestEmailChange(knex, req.user!.id, req.body);
      res.status(202).json({ message: emailChangeRequestedMessage(req.body.email) });
    },
  );
  router.put(
    '/password',
    requireAuth,
    passwordChecks,
    validate({ body: changePasswordInputSchema }),
    async (req, res) => {
      const user = await service.changePassword(knex, req.user!.id, req.body);
      // Every session of the account ends (a thief's too); this browser carries on in a new one.
      await sessions.endAllFor(user.id);
      await sessions.start(req, res, user.id);
      res.json({ user });
    },
  );
  return router;
}

/** Mounted at /api/email-changes: the link mailed to a new address, signed in or not. */
export function emailChangesRouter({ db }: AppDeps) {
  const router = Router();
  const knex = db.knex;
  router.get('/:token', async (req, res) => {
    res.json({ change: await service.previewEmailChange(knex, String(req.params.token)) });
  });
  router.post('/:token', async (req, res) => {
    res.json({ user: await service.confirmEmailChange(knex, String(req.params.token)) });
  });
  return router;
}
