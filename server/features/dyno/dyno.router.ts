import { Router, type Request, type RequestHandler } from 'express';
import multer from 'multer';
import {
  MAX_CURVE_CSV_BYTES,
  MAX_DYNO_ATTACHMENT_BYTES,
  correctionQuerySchema,
  createDynoRunInputSchema,
  createDynoSessionInputSchema,
  dynoFileField,
  updateDynoRunInputSchema,
  updateDynoSessionInputSchema,
} from '@shared/schemas/dyno';
import type { AppDeps } from '@server/lib/deps';
import { AppError, ValidationError, fieldsFromZod } from '@server/lib/errors';
import { param, scoped } from '@server/lib/scope';
import { receiveUpload } from '@server/lib/uploads';
import { sendStoredFile } from '@server/lib/stored-file';
import { validate } from '@server/middleware/validate';
import * as runs from './runs.service';
import * as sessions from './sessions.service';

/**
 * Dyno days, mounted in server/routes.ts: sessions (with their runs and the
 * build's results against the plan) at /api/builds/:buildId/dyno-sessions,
 * and each run (its curve as CSV, its attachment) at /api/builds/:buildId/dyno-runs.
 */

/** `?standard=…&aspiration=…&engineFactor=…`: how to correct what is read. */
function choiceOf(req: Request) {
  const parsed = correctionQuerySchema.safeParse(req.query);
  if (!parsed.success) {
    throw new ValidationError('Unknown correction', fieldsFromZod(parsed.error));
  }
  return parsed.data;
}

const isDryRun = (req: Request) => req.query.dryRun === '1' || req.query.dryRun === 'true';

const mb = (bytes: number) => `${Math.round((bytes / 1024 / 1024) * 10) / 10} MB`;

/** One file in memory (a CSV is at most 2 MB, an attachment 15 MB), plus a few short fields. */
function receiveFile(maxBytes: number, what: string): RequestHandler {
  const upload = multer({
    storage: multer.memoryStorage(),
    limits: { fileSize: maxBytes, files: 1, fields: 4, fieldSize: 64 * 1024 },
  }).single(dynoFileField);
  return receiveUpload(upload, (err) => {
    const message =
      err.code === 'LIMIT_FILE_SIZE'
        ? `The ${what} is larger than ${mb(maxBytes)}; nothing was saved`
        : err.code === 'LIMIT_UNEXPECTED_FILE' || err.code === 'LIMIT_FILE_COUNT'
          ? `Send one ${what} in the "${dynoFileField}" field`
          : `The upload was refused: ${err.message}`;
    return {
      code: err.code === 'LIMIT_FILE_SIZE' ? 'file_too_large' : 'bad_upload',
      message,
      fields: { [dynoFileField]: message },
    };
  });
}

function fileOf(req: Request, what: string): Buffer {
  if (!req.file) {
    throw new AppError(400, 'no_file', `Attach the ${what} in the "${dynoFileField}" field`, {
      [dynoFileField]: `Choose a ${what}`,
    });
  }
  return req.file.buffer;
}

function access(deps: AppDeps) {
  return {
    read: deps.access('dyno:read'),
    write: deps.access('dyno:write'),
    remove: deps.access('dyno:delete'),
    knex: deps.db.knex,
    store: { storage: deps.storage, logger: deps.logger },
  };
}

/** Mounted at /api/builds/:buildId/dyno-sessions. */
export function dynoSessionsRouter(deps: AppDeps) {
  const router = Router({ mergeParams: true });
  const { read, write, remove, knex, store } = access(deps);
  const id = (req: Request) => param(req, 'sessionId');
  const csv = receiveFile(MAX_CURVE_CSV_BYTES, 'CSV file');

  router.get(
    '/',
    read,
    scoped(knex, (s, req) => sessions.listSessions(s, choiceOf(req))),
  );
  router.post(
    '/',
    write,
    validate({ body: createDynoSessionInputSchema }),
    scoped(knex, async (s, req) => ({ session: await sessions.createSession(s, req.body) }), 201),
  );
  router.get(
    '/:sessionId',
    read,
    scoped(knex, (s, req) => sessions.getSession(s, id(req), choiceOf(req))),
  );
  router.patch(
    '/:sessionId',
    write,
    validate({ body: updateDynoSessionInputSchema }),
    scoped(knex, async (s, req) => ({
      session: await sessions.updateSession(s, id(req), req.body),
    })),
  );
  router.delete(
    '/:sessionId',
    remove,
    scoped(knex, (s, req) => sessions.deleteSession(s, store, id(req))),
  );
  router.post(
    '/:sessionId/runs',
    write,
    validate({ body: createDynoRunInputSchema }),
    scoped(knex, (s, req) => runs.createRun(s, id(req), req.body), 201),
  );
  router.post(
    '/:sessionId/runs/import',
    write,
    csv,
    scoped(knex, async (s, req, res) => {
      const result = await runs.importRun(
        s,
        id(req),
        fileOf(req, 'CSV file'),
        req.body?.run,
        isDryRun(req),
      );
      res.status(result.dryRun ? 200 : 201).json(result);
    }),
  );
  return router;
}

/** Mounted at /api/builds/:buildId/dyno-runs. */
export function dynoRunsRouter(deps: AppDeps) {
  const router = Router({ mergeParams: true });
  const { read, write, remove, knex, store } = access(deps);
  const id = (req: Request) => param(req, 'runId');

  router.get(
    '/:runId',
    read,
    scoped(knex, (s, req) => runs.getRun(s, id(req), choiceOf(req))),
  );
  router.patch(
    '/:runId',
    write,
    validate({ body: updateDynoRunInputSchema }),
    scoped(knex, (s, req) => runs.updateRun(s, id(req), req.body)),
  );
  router.delete(
    '/:runId',
    remove,
    scoped(knex, (s, req) => runs.deleteRun(s, store, id(req))),
  );
  router.get(
    '/:runId/curve.csv',
    read,
    scoped(knex, async (s, req, res) => {
      const { fileName, csv } = await runs.exportCurve(s, id(req));
      res.attachment(fileName).type('text/csv; charset=utf-8').send(csv);
    }),
  );
  router.put(
    '/:runId/curve.csv',
    write,
    receiveFile(MAX_CURVE_CSV_BYTES, 'CSV file'),
    scoped(knex, async (s, req, res) => {
      const result = await runs.replaceCurve(s, id(req), fileOf(req, 'CSV file'), isDryRun(req));
      res.status(200).json(result);
    }),
  );
  router.get(
    '/:runId/attachment',
    read,
    scoped(knex, async (s, req, res) => {
      const { key, attachment, runId } = await runs.getAttachment(s, id(req));
      // A download, whatever the name says; its type is what the content was checked to be.
      // Members only (private caching); from the object store by a signed link when it has one.
      await sendStoredFile(res, deps.storage, key, {
        contentType: attachment.contentType,
        disposition: 'attachment',
        fileName: attachment.name,
        cacheSeconds: 3600,
        missingMessage: 'The attached file is missing',
        onMissing: () => store.logger.error({ runId }, 'dyno attachment missing from storage'),
      });
    }),
  );
  router.put(
    '/:runId/attachment',
    write,
    receiveFile(MAX_DYNO_ATTACHMENT_BYTES, 'file'),
    scoped(knex, (s, req) => runs.putAttachment(s, store, id(req), req.file)),
  );
  router.delete(
    '/:runId/attachment',
    remove,
    scoped(knex, (s, req) => runs.deleteAttachment(s, store, id(req))),
  );
  return router;
}
