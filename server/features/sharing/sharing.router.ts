/**
 * Sharing, mounted in server/routes.ts: the owner's settings at
 * /api/builds/:buildId/share, the build sheet at /api/builds/:buildId/sheet, and
 * the public page's data and photos at /api/shared/:token (no session, nothing
 * writable). The public page's HTML is sharing.shell.ts, mounted by the app.
 */
import { Router, type Request } from 'express';
import { can } from '@shared/permissions';
import {
  photoVisibilityInputSchema,
  regenerateShareInputSchema,
  sheetQuerySchema,
  updateShareInputSchema,
} from '@shared/schemas/sharing';
import { shareSections } from '@shared/sharing/vocabulary';
import type { PhotoSize } from '@shared/schemas/photos';
import type { AppDeps } from '@server/lib/deps';
import { NotFoundError, ValidationError, fieldsFromZod } from '@server/lib/errors';
import { param } from '@server/lib/scope';
import { validate } from '@server/middleware/validate';
import * as photos from '@server/features/photos';
import { publicHeaders, sendPublic } from './sharing.http';
import { sharedLimits } from './sharing.limits';
import * as service from './sharing.service';
import { composeView } from './sharing.view';

const everySection = Object.fromEntries(shareSections.map((s) => [s, true])) as Record<
  (typeof shareSections)[number],
  true
>;

/** Mounted at /api/builds/:buildId/share: the owner's switch, choices and address. */
export function shareSettingsRouter(deps: AppDeps) {
  const router = Router({ mergeParams: true });
  const ctx: service.ShareCtx = { knex: deps.db.knex, appUrl: deps.config.appUrl };
  const manage = deps.access('share:manage');
  const build = (req: Request) => req.membership!.buildId;

  router.get('/', manage, async (req, res) => {
    res.json({ share: await service.getSettings(ctx, build(req)) });
  });
  router.put('/', manage, validate({ body: updateShareInputSchema }), async (req, res) => {
    res.json({ share: await service.updateSettings(ctx, build(req), req.body) });
  });
  router.post(
    '/regenerate',
    manage,
    validate({ body: regenerateShareInputSchema }),
    async (req, res) => {
      res.json({ share: await service.regenerate(ctx, build(req)) });
    },
  );
  router.put(
    '/photos/:photoId',
    manage,
    validate({ body: photoVisibilityInputSchema }),
    async (req, res) => {
      const photo = await service.setPhotoVisibility(
        ctx,
        build(req),
        param(req, 'photoId'),
        req.body.public,
      );
      res.json({ photo, share: await service.getSettings(ctx, build(req)) });
    },
  );
  return router;
}

/** Mounted at /api/builds/:buildId/sheet: the whole build for print; money on the owner's, if asked. */
export function buildSheetRouter(deps: AppDeps) {
  const router = Router({ mergeParams: true });
  router.get('/', deps.access('sheet:read'), async (req, res) => {
    const query = sheetQuerySchema.safeParse(req.query);
    if (!query.success) throw new ValidationError('Unknown option', fieldsFromZod(query.error));
    const { buildId, role } = req.membership!;
    const mayShowMoney = can(role, 'money:read');
    const sheet = await composeView(deps.db.knex, buildId, {
      kind: 'member',
      sections: everySection,
      showNames: true,
      money: mayShowMoney && query.data.money === '1',
      coverPhotoId: null,
    });
    res.json({ sheet, mayShowMoney });
  });
  return router;
}

/** Mounted at /api/shared (before any session is read): a shared build's data and public photos. */
export function sharedRouter(deps: AppDeps) {
  const router = Router();
  const { knex } = deps.db;
  const limits = sharedLimits(deps);

  router.get('/:token', limits.page, async (req, res) => {
    const share = await service.resolve(knex, param(req, 'token'));
    const base = `/api/shared/${share.token}`;
    const view = await composeView(knex, share.buildId, {
      kind: 'public',
      sections: share.sections,
      showNames: share.showMemberNames,
      money: false,
      coverPhotoId: share.coverPhotoId,
      photoUrl: (id, size) => `${base}/photos/${id}/${size}`,
    });
    sendPublic(req, res, JSON.stringify({ build: view }), {
      type: 'json',
      allowIndexing: share.allowIndexing,
    });
  });
  for (const size of ['web', 'thumb'] as const satisfies PhotoSize[]) {
    router.get(`/:token/photos/:photoId/${size}`, limits.photo, async (req, res) => {
      const share = await service.resolve(knex, param(req, 'token'));
      publicHeaders(res, share.allowIndexing);
      // A link preview on another site may show the cover photo straight from here.
      res.set('Cross-Origin-Resource-Policy', 'cross-origin');
      if (!share.sections.photos) throw new NotFoundError('Photo not found');
      const file = await photos.publicFile(
        { knex, storage: deps.storage, logger: deps.logger },
        share.buildId,
        param(req, 'photoId'),
        size,
      );
      sendPublic(req, res, file.data, {
        type: file.contentType,
        allowIndexing: share.allowIndexing,
      });
    });
  }
  return router;
}
