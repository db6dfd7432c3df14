import { createHash } from 'node:crypto';
import { createReadStream } from 'node:fs';
import fs from 'node:fs/promises';
import { Router, type Request, type RequestHandler } from 'express';
import multer from 'multer';
import {
  maxPhotosPerUpload,
  photoUploadField,
  updatePhotoInputSchema,
  uploadPhotoFieldsSchema,
  type PhotoSize,
} from '@shared/schemas/photos';
import type { AppDeps } from '@server/lib/deps';
import { answerOnce } from '@server/lib/idempotency';
import { sendStoredFile } from '@server/lib/stored-file';
import { receiveUpload } from '@server/lib/uploads';
import { assertNoNul, validate } from '@server/middleware/validate';
import * as service from './photos.service';

/**
 * Receives photos into a temporary folder (never memory: ten 25 MB files would
 * be 250 MB per request). Multer removes its own files when it fails part-way;
 * the route removes the rest once the request is answered, whatever happened.
 */
function receivePhotos(deps: AppDeps): RequestHandler {
  const mb = Math.round((deps.config.photoMaxBytes / 1024 / 1024) * 10) / 10;
  const upload = multer({
    storage: multer.diskStorage({ destination: deps.config.uploadTmpDir }),
    limits: {
      fileSize: deps.config.photoMaxBytes,
      files: maxPhotosPerUpload,
      fields: 5,
      fieldSize: 10_000,
    },
  }).array(photoUploadField, maxPhotosPerUpload);
  return receiveUpload(upload, (err) => ({
    code: err.code === 'LIMIT_FILE_SIZE' ? 'file_too_large' : 'bad_upload',
    message:
      err.code === 'LIMIT_FILE_SIZE'
        ? `${err.field ? 'A photo' : 'The file'} is larger than ${mb} MB; nothing was saved`
        : err.code === 'LIMIT_FILE_COUNT' || err.code === 'LIMIT_UNEXPECTED_FILE'
          ? `Send up to ${maxPhotosPerUpload} photos at a time in the "${photoUploadField}" field`
          : `The upload was refused: ${err.message}`,
  }));
}

/** The uploaded files' contents, for telling a repeat of an upload from another upload. */
async function filesDigest(files: { path: string }[]) {
  const hashes: string[] = [];
  for (const f of files) {
    const hash = createHash('sha256');
    for await (const chunk of createReadStream(f.path)) hash.update(chunk as Buffer);
    hashes.push(hash.digest('hex'));
  }
  return hashes.join(',');
}

async function removeTemp(req: Request) {
  const files = Array.isArray(req.files) ? req.files : [];
  await Promise.all(files.map((f) => (f.path ? fs.rm(f.path, { force: true }) : undefined)));
}

function photoRoutes(deps: AppDeps) {
  const knex = deps.db.knex;
  const ctx: service.Ctx = { knex, storage: deps.storage, logger: deps.logger };
  const caller = (req: Request): service.Caller => ({
    userId: req.user!.id,
    role: req.membership!.role,
  });
  const build = (req: Request) => req.membership!.buildId;
  const param = (req: Request, name: string) => String(req.params[name]);
  return { knex, ctx, caller, build, param };
}

/** Mounted at /api/builds/:buildId/photos: the build's gallery and each photo. */
export function photosRouter(deps: AppDeps) {
  const router = Router({ mergeParams: true });
  const { knex, ctx, caller, build, param } = photoRoutes(deps);
  const read = deps.access('photos:read');

  router.get('/', read, async (req, res) => {
    res.json({ photos: await service.list(knex, build(req), caller(req)) });
  });
  router.get('/:photoId', read, async (req, res) => {
    res.json({ photo: await service.get(knex, build(req), param(req, 'photoId'), caller(req)) });
  });
  for (const size of ['web', 'thumb'] as const satisfies PhotoSize[]) {
    router.get(`/:photoId/${size}`, read, async (req, res) => {
      const { key, contentType, photo } = await service.storedFile(
        knex,
        build(req),
        param(req, 'photoId'),
        caller(req),
        size,
      );
      await sendStoredFile(res, deps.storage, key, {
        contentType,
        disposition: 'inline',
        fileName: `photo-${photo.id}-${size}.jpg`,
        // Private (only members may see it): no shared cache may keep it.
        cacheSeconds: 3600,
        missingMessage: 'Photo file not found',
        onMissing: () =>
          deps.logger.error({ photoId: photo.id, size }, 'photo file missing from storage'),
      });
    });
  }
  router.patch(
    '/:photoId',
    deps.access('photos:update'),
    validate({ body: updatePhotoInputSchema }),
    async (req, res) => {
      res.json({
        photo: await service.updateCaption(
          knex,
          build(req),
          param(req, 'photoId'),
          caller(req),
          req.body,
        ),
      });
    },
  );
  router.delete('/:photoId', deps.access('photos:delete'), async (req, res) => {
    await service.remove(ctx, build(req), param(req, 'photoId'), caller(req));
    res.status(204).end();
  });
  return router;
}

/**
 * The photos of one step or one part: mounted at
 * /api/builds/:buildId/steps/:stepId/photos and /api/builds/:buildId/parts/:partId/photos.
 */
export function subjectPhotosRouter(deps: AppDeps, subject: 'stepId' | 'partId') {
  const router = Router({ mergeParams: true });
  const { knex, ctx, caller, build, param } = photoRoutes(deps);
  const target = (req: Request): service.Subject =>
    subject === 'stepId' ? { stepId: param(req, 'stepId') } : { partId: param(req, 'partId') };

  router.get('/', deps.access('photos:read'), async (req, res) => {
    res.json({ photos: await service.list(knex, build(req), caller(req), target(req)) });
  });
  router.post('/', deps.access('photos:upload'), receivePhotos(deps), async (req, res) => {
    try {
      assertNoNul(req.body);
      const fields = uploadPhotoFieldsSchema.parse({ ...req.body });
      const files = (Array.isArray(req.files) ? req.files : []) as service.UploadedFile[];
      // With an Idempotency-Key (the offline queue), the same photos sent twice are stored once.
      await answerOnce(
        knex,
        req,
        res,
        201,
        async (db) => ({
          photos: await service.upload(
            { ...ctx, knex: db },
            build(req),
            caller(req),
            target(req),
            files,
            fields.caption ?? '',
          ),
        }),
        () => filesDigest(files),
      );
    } finally {
      await removeTemp(req);
    }
  });
  return router;
}
