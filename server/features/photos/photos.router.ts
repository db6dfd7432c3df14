import fs from 'node:fs/promises';
import { Router, type Request, type RequestHandler } from 'express';
import multer, { MulterError } from 'multer';
import {
  maxPhotosPerUpload,
  photoUploadField,
  updatePhotoInputSchema,
  uploadPhotoFieldsSchema,
  type PhotoSize,
} from '../../../shared/schemas/photos';
import type { AppDeps } from '../../app';
import { AppError } from '../../lib/errors';
import { buildAccess } from '../../middleware/build-access';
import { validate } from '../../middleware/validate';
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
  return (req, res, next) => {
    upload(req, res, (err: unknown) => {
      if (!(err instanceof MulterError)) return next(err);
      const message =
        err.code === 'LIMIT_FILE_SIZE'
          ? `${err.field ? 'A photo' : 'The file'} is larger than ${mb} MB; nothing was saved`
          : err.code === 'LIMIT_FILE_COUNT' || err.code === 'LIMIT_UNEXPECTED_FILE'
            ? `Send up to ${maxPhotosPerUpload} photos at a time in the "${photoUploadField}" field`
            : `The upload was refused: ${err.message}`;
      next(
        new AppError(
          400,
          err.code === 'LIMIT_FILE_SIZE' ? 'file_too_large' : 'bad_upload',
          message,
        ),
      );
    });
  };
}

async function removeTemp(req: Request) {
  const files = Array.isArray(req.files) ? req.files : [];
  await Promise.all(files.map((f) => (f.path ? fs.rm(f.path, { force: true }) : undefined)));
}

/** Mounted at /api/builds/:buildId (photos of steps and parts, the build's gallery). */
export function photosRouter(deps: AppDeps) {
  const router = Router({ mergeParams: true });
  const knex = deps.db.knex;
  const ctx: service.Ctx = { knex, storage: deps.storage, logger: deps.logger };
  const read = buildAccess(knex, 'photos:read');
  const uploadAccess = buildAccess(knex, 'photos:upload');
  const receive = receivePhotos(deps);
  const caller = (req: Request): service.Caller => ({
    userId: req.user!.id,
    role: req.membership!.role,
  });
  const build = (req: Request) => req.membership!.buildId;
  const param = (req: Request, name: string) => String(req.params[name]);

  const uploadTo =
    (subject: (req: Request) => service.Subject): RequestHandler =>
    async (req, res) => {
      try {
        const fields = uploadPhotoFieldsSchema.parse({ ...req.body });
        const files = (Array.isArray(req.files) ? req.files : []) as service.UploadedFile[];
        const photos = await service.upload(
          ctx,
          build(req),
          caller(req),
          subject(req),
          files,
          fields.caption ?? '',
        );
        res.status(201).json({ photos });
      } finally {
        await removeTemp(req);
      }
    };

  router.get('/photos', read, async (req, res) => {
    res.json({ photos: await service.list(knex, build(req), caller(req)) });
  });
  router.get('/steps/:stepId/photos', read, async (req, res) => {
    res.json({
      photos: await service.list(knex, build(req), caller(req), { stepId: param(req, 'stepId') }),
    });
  });
  router.get('/parts/:partId/photos', read, async (req, res) => {
    res.json({
      photos: await service.list(knex, build(req), caller(req), { partId: param(req, 'partId') }),
    });
  });
  router.post(
    '/steps/:stepId/photos',
    uploadAccess,
    receive,
    uploadTo((req) => ({ stepId: param(req, 'stepId') })),
  );
  router.post(
    '/parts/:partId/photos',
    uploadAccess,
    receive,
    uploadTo((req) => ({ partId: param(req, 'partId') })),
  );
  router.get('/photos/:photoId', read, async (req, res) => {
    res.json({ photo: await service.get(knex, build(req), param(req, 'photoId'), caller(req)) });
  });
  for (const size of ['web', 'thumb'] as const satisfies PhotoSize[]) {
    router.get(`/photos/:photoId/${size}`, read, async (req, res) => {
      const { data, contentType, photo } = await service.file(
        ctx,
        build(req),
        param(req, 'photoId'),
        caller(req),
        size,
      );
      res
        .type(contentType)
        // Private: only members may see it, so no shared cache may keep it.
        .set('Cache-Control', 'private, max-age=3600')
        .set('Content-Disposition', `inline; filename="photo-${photo.id}-${size}.jpg"`)
        .send(data);
    });
  }
  router.patch(
    '/photos/:photoId',
    buildAccess(knex, 'photos:update'),
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
  router.delete('/photos/:photoId', buildAccess(knex, 'photos:delete'), async (req, res) => {
    await service.remove(ctx, build(req), param(req, 'photoId'), caller(req));
    res.status(204).end();
  });
  return router;
}
