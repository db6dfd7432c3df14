import { Router } from 'express';
import { signInInputSchema, signUpInputSchema } from '@shared/schemas/auth';
import type { AppDeps } from '@server/lib/deps';
import { requireAuth } from '@server/middleware/require-auth';
import { authLimits } from '@server/middleware/rate-limit';
import { validate } from '@server/middleware/validate';
import * as service from './auth.service';

export function authRouter({ db, config, sessions }: AppDeps) {
  const router = Router();
  const signUpLimits = authLimits(db.knex, config, 'sign-up');
  const signInLimits = authLimits(db.knex, config, 'sign-in', { perAccount: true });

  router.post(
    '/sign-up',
    ...signUpLimits,
    validate({ body: signUpInputSchema }),
    async (req, res) => {
      const user = await service.signUp(db.knex, req.body);
      await sessions.replace(req, res, user.id);
      res.status(201).json({ user });
    },
  );

  router.post(
    '/sign-in',
    ...signInLimits,
    validate({ body: signInInputSchema }),
    async (req, res) => {
      const user = await service.signIn(db.knex, req.body);
      // A new sign-in in this browser ends the session it had before.
      await sessions.replace(req, res, user.id);
      res.json({ user });
    },
  );

  router.post('/sign-out', requireAuth, async (req, res) => {
    await sessions.end(req, res, req.sessionId!);
    res.status(204).end();
  });

  return router;
}
