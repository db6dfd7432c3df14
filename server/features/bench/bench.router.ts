import fs from 'node:fs/promises';
import { Router, type Request, type RequestHandler } from 'express';
import multer from 'multer';
import {
  BENCH_ORIGINAL_MAX_BYTES,
  benchCompareQuerySchema,
  benchListQuerySchema,
  benchUploadField,
  createBenchSheetInputSchema,
  updateBenchSheetInputSchema,
} from '@shared/schemas/bench';
import type { AppDeps } from '@server/lib/deps';
import { AppError } from '@server/lib/errors';
import { param, scoped } from '@server/lib/scope';
import { sendStoredFile } from '@server/lib/stored-file';
import { receiveUpload } from '@server/lib/uploads';
import { validate } from '@server/middleware/validate';
import * as service from './bench.service';

/** A CSV of one sheet's values is small: 8–16 rows of a few numbers. */
export const maxBenchCsvBytes = 256 * 1024;

const maxMb = BENCH_ORIGINAL_MAX_BYTES / 1024 / 1024;

/**
 * The original sheet goes to a temporary folder (never memory: 20 MB per
 * request adds up), is checked by content, and the temporary file is removed
 * once the request is answered, whatever happened. Names are read as UTF-8.
 */
function receiveOriginal(deps: AppDeps): RequestHandler {
  const options: multer.Options & { defParamCharset: string } = {
    storage: multer.diskStorage({ destination: deps.config.uploadTmpDir }),
    limits: { fileSize: BENCH_ORIGINAL_MAX_BYTES, files: 1, fields: 2, fieldSize: 1000 },
    defParamCharset: 'utf8',
  };
  return receiveUpload(multer(options).single(benchUploadField), (err) => ({
    code: err.code === 'LIMIT_FILE_SIZE' ? 'file_too_large' : 'bad_upload',
    message:
      err.code === 'LIMIT_FILE_SIZE'
        ? `The sheet is larger than ${maxMb} MB; nothing was saved. Send a smaller photo or PDF.`
        : err.code === 'LIMIT_FILE_COUNT' || err.code === 'LIMIT_UNEXPECTED_FILE'
          ? `Send one file, in the "${benchUploadField}" field`
          : `The upload was refused: ${err.message}`,
  }));
}

const receiveCsv = receiveUpload(
  multer({
    storage: multer.memoryStorage(),
    limits: { fileSize: maxBenchCsvBytes, files: 1, fields: 2, fieldSize: 1000 },
  }).single(benchUploadField),
  (err) => ({
    code: err.code === 'LIMIT_FILE_SIZE' ? 'file_too_large' : 'bad_upload',
    message:
      err.code === 'LIMIT_FILE_SIZE'
        ? `A sheet's CSV is at most ${maxBenchCsvBytes / 1024} KB`
        : err.code === 'LIMIT_FILE_COUNT' || err.code === 'LIMIT_UNEXPECTED_FILE'
          ? `Send one CSV file, in the "${benchUploadField}" field`
          : `The upload was refused: ${err.message}`,
  }),
);

async function removeTemp(req: Request) {
  if (req.file?.path) await fs.rm(req.file.path, { force: true });
}

const isDryRun = (req: Request) => req.query.dryRun === '1' || req.query.dryRun === 'true';

/** Mounted at /api/builds/:buildId/bench-sheets. */
export function benchSheetsRouter(deps: AppDeps) {
  const router = Router({ mergeParams: true });
  const knex = deps.db.knex;
  const ctx: service.Ctx = { knex, storage: deps.storage, logger: deps.logger };
  const read = deps.access('bench:read');
  const write = deps.access('bench:write');
  const remove = deps.access('bench:delete');
  const sheetId = (req: Request) => param(req, 'sheetId');

  router.get(
    '/',
    read,
    scoped(knex, async (s, req) => ({
      sheets: await service.list(
        s.knex,
        s.buildId,
        s.caller,
        benchListQuerySchema.parse(req.query),
      ),
    })),
  );
  router.post(
    '/',
    write,
    validate({ body: createBenchSheetInputSchema }),
    scoped(knex, (s, req) => service.create(s.knex, s.buildId, s.caller, req.body), 201),
  );
  router.get(
    '/compare',
    read,
    scoped(knex, (s, req) => {
      const q = benchCompareQuerySchema.parse(req.query);
      return service.compare(s.knex, s.buildId, s.caller, { before: q.before!, after: q.after! });
    }),
  );
  router.get(
    '/:sheetId',
    read,
    scoped(knex, (s, req) => service.get(s.knex, s.buildId, sheetId(req), s.caller)),
  );
  router.patch(
    '/:sheetId',
    write,
    validate({ body: updateBenchSheetInputSchema }),
    scoped(knex, (s, req) => service.update(s.knex, s.buildId, sheetId(req), s.caller, req.body)),
  );
  router.delete(
    '/:sheetId',
    remove,
    scoped(knex, (s, req) =>
      service.remove({ ...ctx, knex: s.knex }, s.buildId, sheetId(req), s.caller),
    ),
  );

  router.get(
    '/:sheetId/values.csv',
    read,
    scoped(knex, async (s, req, res) => {
      const { sheet, csv } = await service.exportCsv(s.knex, s.buildId, sheetId(req), s.caller);
      const name = `${sheet.occasion.replace(/[^A-Za-z0-9 _-]+/g, '').trim() || 'bench-sheet'}.csv`;
      res.type('text/csv; charset=utf-8').attachment(name).send(csv);
    }),
  );
  router.post(
    '/:sheetId/import',
    write,
    receiveCsv,
    scoped(knex, async (s, req) => {
      if (!req.file) {
        throw new AppError(400, 'no_file', `Attach a CSV file in the "${benchUploadField}" field`, {
          file: 'Choose a CSV file',
        });
      }
      return service.importCsv(
        s.knex,
        s.buildId,
        sheetId(req),
        s.caller,
        req.file.buffer,
        isDryRun(req),
      );
    }),
  );

  // The shop's original sheet: one per sheet; every file is a download, for members only.
  router.put(
    '/:sheetId/original',
    write,
    receiveOriginal(deps),
    scoped(knex, async (s, req) => {
      try {
        return {
          original: await service.attachOriginal(
            { ...ctx, knex: s.knex },
            s.buildId,
            sheetId(req),
            s.caller,
            req.file,
          ),
        };
      } finally {
        await removeTemp(req);
      }
    }),
  );
  router.delete(
    '/:sheetId/original',
    remove,
    scoped(knex, (s, req) =>
      service.removeOriginal({ ...ctx, knex: s.knex }, s.buildId, sheetId(req), s.caller),
    ),
  );
  for (const size of ['original', 'web', 'thumb'] as const) {
    router.get(
      size === 'original' ? '/:sheetId/original' : `/:sheetId/original/${size}`,
      read,
      scoped(knex, async (s, req, res) => {
        const file = await service.originalFile(s.knex, s.buildId, sheetId(req), s.caller, size);
        await sendStoredFile(res, deps.storage, file.key, {
          contentType: file.contentType,
          // Always a download: a PDF never opens as a page of this site.
          disposition: 'attachment',
          fileName: file.fileName,
          // Members only: no shared cache may keep it.
          cacheSeconds: 3600,
          missingMessage: 'The file of this original is missing',
          onMissing: () =>
            deps.logger.error(
              { sheetId: file.sheetId, size },
              'bench original missing from storage',
            ),
        });
      }),
    );
  }
  return router;
}
