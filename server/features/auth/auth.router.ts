import { Router } from 'express';
import { signInInputSchema, signUpInputSchema } from '../../../shared/schemas/auth';
import type { AppDeps } from '../../lib/deps';
import { requireAuth } from '../../middleware/require-auth';
import { createRateLimit } from '../../middleware/rate-limit';
import { validate } from '../../middleware/validate';
import * as service from './auth.service';

export function authRouter({ db, config, sessions }: AppDeps) {
  const router = Router();
  const limit = createRateLimit(db.knex, {
    prefix: `${config.rateLimitPrefix}auth:`,
    limit: config.authRateLimit,
    windowMs: 15 * 60_000,
    message: 'Too many sign-in attempts from here. Wait 15 minutes and try again.',
  });

  router.post('/sign-up', limit, validate({ body: signUpInputSchema }), async (req, res) => {
    const user = await service.signUp(db.knex, req.body);
    await sessions.start(req, res, user.id);
    res.status(201).json({ user });
  });

  router.post('/sign-in', limit, validate({ body: signInInputSchema }), async (req, res) => {
    const user = await service.signIn(db.knex, req.body);
    await sessions.start(req, res, user.id);
    res.json({ user });
  });

  router.post('/sign-out', requireAuth, async (req, res) => {
    await sessions.end(req, res, req.sessionId!);
    res.status(204).end();
  });

  return router;
}

export function meRouter() {
  const router = Router();
  router.get('/', requireAuth, (req, res) => {
    res.json({ user: req.user });
  });
  return router;
}
