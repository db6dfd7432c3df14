import { Router } from 'express';
import multer from 'multer';
import { createPartInputSchema, updatePartInputSchema } from '@shared/schemas/parts';
import type { AppDeps } from '@server/lib/deps';
import { AppError } from '@server/lib/errors';
import { validate } from '@server/middleware/validate';
import { receiveUpload } from '@server/lib/uploads';
import * as service from './parts.service';

export const maxCsvBytes = 2 * 1024 * 1024;
const upload = multer({
  storage: multer.memoryStorage(),
  limits: { fileSize: maxCsvBytes, files: 1 },
});

/** Mounted at /api/builds/:buildId/parts. */
export function partsRouter(deps: AppDeps) {
  const { db } = deps;
  const router = Router({ mergeParams: true });
  const knex = db.knex;
  const caller = (req: Express.Request): service.Caller => ({
    userId: req.user!.id,
    role: req.membership!.role,
  });

  router.get('/', deps.access('parts:read'), shopQuote, async (req, res) => {
    res.json({
      parts: await service.list(knex, req.membership!.buildId, caller(req), req.membership!.build),
    });
  });
  router.post(
    '/',
    deps.access('parts:create'),
    validate({ body: createPartInputSchema }),
    async (req, res) => {
      res.status(201).json({ part: await service.create(knex, req.membership!.buildId, req.body) });
    },
  );
  router.post(
    '/import',
    deps.access('parts:import'),
    receiveUpload(upload.single('file')),
    async (req, res) => {
      if (!req.file) throw new AppError(400, 'no_file', 'Attach a CSV file in the "file" field');
      const dryRun = req.query.dryRun === '1' || req.query.dryRun === 'true';
      const result = await service.importCsv(
        knex,
        req.membership!.buildId,
        req.file.buffer,
        dryRun,
      );
      res.status(dryRun ? 200 : 201).json({ dryRun, saved: result.saved, rows: result.rows });
    },
  );
  router.get('/:partId', deps.access('parts:read'), shopQuote, async (req, res) => {
    res.json({
      part: await service.get(
        knex,
        req.membership!.buildId,
        String(req.params.partId),
        caller(req),
      ),
    });
  });
  router.patch(
    '/:partId',
    deps.access('parts:update'),
    shopQuote,
    validate({ body: updatePartInputSchema }),
    async (req, res) => {
      res.json({
        part: await service.update(
          knex,
          req.membership!.buildId,
          String(req.params.partId),
          caller(req),
          req.body,
        ),
      });
    },
  );
  router.delete('/:partId', deps.access('parts:delete'), async (req, res) => {
    await service.remove(
      knex,
      req.membership!.buildId,
      String(req.params.partId),
      caller(req),
      deps,
    );
    res.status(204).end();
  });
  return router;
}

/** Mounted at /api/builds/:buildId/parts.csv: the ledger as a spreadsheet file. */
export function partsCsvRouter(deps: AppDeps) {
  const router = Router({ mergeParams: true });
  const knex = deps.db.knex;
  router.get('/', deps.access('parts:read'), async (req, res) => {
    const { fileName, csv } = await service.exportCsv(knex, req.membership!.buildId, {
      userId: req.user!.id,
      role: req.membership!.role,
    });
    res.attachment(fileName).type('text/csv; charset=utf-8').send(csv);
  });
  return router;
}

/** A shop sees its own labour quote on the parts sent to it, and no other money. */
const shopQuote: import('express').RequestHandler = (req, res, next) => {
  if (req.membership?.role === 'shop') res.locals.moneyAllow = new Set(['labourCents']);
  next();
};
