import { Router } from 'express';
import type { AppDeps } from '@server/lib/deps';

export function healthRouter({ db }: AppDeps) {
  const router = Router();
  router.get('/', async (_req, res) => {
    try {
      await db.ping();
      res.json({ ok: true });
    } catch {
      res.status(503).json({
        ok: false,
        error: { code: 'database_unavailable', message: 'The database is not answering' },
      });
    }
  });
  return router;
}
