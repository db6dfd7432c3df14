/**
 * Photo log rules. Every member reads the build's photos, except a shop, which
 * sees the photos of its own parts and of the steps linked to them. Owner and
 * crew add photos to steps and parts; a shop adds them to the parts sent to it.
 * An upload is all or nothing: every file is checked and converted before any
 * is stored.
 */
import { randomUUID } from 'node:crypto';
import type { Knex } from 'knex';
import { canAddPhotosTo, canCaptionPhoto } from '@shared/permissions';
import type { Photo, PhotoSize, UpdatePhotoInput } from '@shared/schemas/photos';
import { AppError, ForbiddenError, NotFoundError } from '@server/lib/errors';
import type { Logger } from '@server/lib/logger';
import { parseId, type Caller } from '@server/lib/scope';
import type { Storage } from '@server/lib/storage';
import * as storedFiles from '@server/features/files';
import * as installLog from '@server/features/install-log';
import * as parts from '@server/features/parts';
import * as repo from './photos.repository';
import { processPhoto, type ProcessedPhoto } from './photos.images';

export type { Caller };
export type Ctx = { knex: Knex; storage: Storage; logger: Logger };
export type Subject = { stepId: string } | { partId: string };
export type UploadedFile = { path: string; originalname: string; size: number };

async function shopScope(knex: Knex, buildId: string, caller: Caller) {
  const stepIds = await installLog.visibleSteps(knex, buildId, caller);
  return stepIds ? { userId: caller.userId, stepIds: [...stepIds] } : undefined;
}

/** The step or part a photo belongs to, checked against what the caller may see. */
async function loadSubject(knex: Knex, buildId: string, subject: Subject, caller: Caller) {
  if ('stepId' in subject) {
    const step = await installLog.getVisibleStep(knex, buildId, subject.stepId, caller);
    return { stepId: step.id, partId: null };
  }
  const part = await parts.getVisible(knex, buildId, subject.partId, caller);
  return { stepId: null, partId: part.id };
}

export async function list(
  knex: Knex,
  buildId: string,
  caller: Caller,
  subject?: Subject,
): Promise<Photo[]> {
  const where = subject
    ? await loadSubject(knex, buildId, subject, caller)
    : { stepId: null, partId: null };
  const photos = await repo.listPhotos(
    knex,
    buildId,
    {
      stepId: where.stepId ?? undefined,
      partId: where.partId ?? undefined,
      shop: await shopScope(knex, buildId, caller),
    },
    // A step's or part's photos read as a log, oldest first; the build's gallery shows the newest first.
    subject ? 'asc' : 'desc',
  );
  return photos.map(repo.present);
}

async function load(knex: Knex, buildId: string, rawPhotoId: string, caller: Caller) {
  const photo = await repo.findPhoto(knex, buildId, parseId(rawPhotoId, 'Photo'));
  if (!photo) throw new NotFoundError('Photo not found');
  // A photo of something the caller may not see does not exist for them.
  await loadSubject(
    knex,
    buildId,
    photo.stepId ? { stepId: photo.stepId } : { partId: photo.partId! },
    caller,
  ).catch((err: unknown) => {
    throw err instanceof NotFoundError ? new NotFoundError('Photo not found') : err;
  });
  return photo;
}

export async function get(knex: Knex, buildId: string, rawPhotoId: string, caller: Caller) {
  return repo.present(await load(knex, buildId, rawPhotoId, caller));
}

/** Where one stored size is kept, for the authenticated image routes (after the access check). */
export async function storedFile(
  knex: Knex,
  buildId: string,
  rawPhotoId: string,
  caller: Caller,
  size: PhotoSize,
) {
  const photo = await load(knex, buildId, rawPhotoId, caller);
  return {
    key: size === 'web' ? photo.webKey : photo.thumbKey,
    contentType: photo.web.contentType,
    photo,
  };
}

export async function upload(
  ctx: Ctx,
  buildId: string,
  caller: Caller,
  subject: Subject,
  files: UploadedFile[],
  caption: string,
) {
  if (!files.length) {
    throw new AppError(400, 'no_file', 'Attach at least one photo in the "photos" field');
  }
  const target = await loadSubject(ctx.knex, buildId, subject, caller);
  if (!canAddPhotosTo(caller.role, target.stepId ? 'step' : 'part')) {
    throw new ForbiddenError('A shop adds photos to the parts sent to it, not to install steps');
  }
  // Check and convert everything first: one bad file refuses the whole upload.
  const processed: ProcessedPhoto[] = [];
  for (const f of files) processed.push(await processPhoto(f.path, f.originalname, f.size));

  const rows: repo.NewPhoto[] = processed.map((p) => {
    const id = randomUUID();
    const prefix = `builds/${buildId}/photos/${id}`;
    return {
      id,
      buildId,
      ...target,
      caption,
      originalFormat: p.format,
      originalWidth: p.width,
      originalHeight: p.height,
      originalBytes: p.bytes,
      contentType: p.contentType,
      webKey: `${prefix}/web.jpg`,
      webWidth: p.web.width,
      webHeight: p.web.height,
      thumbKey: `${prefix}/thumb.jpg`,
      thumbWidth: p.thumb.width,
      thumbHeight: p.thumb.height,
      uploadedBy: caller.userId,
    };
  });
  const written: string[] = [];
  try {
    for (const [i, row] of rows.entries()) {
      await ctx.storage.put(row.webKey, processed[i].web.data, row.contentType);
      written.push(row.webKey);
      await ctx.storage.put(row.thumbKey, processed[i].thumb.data, row.contentType);
      written.push(row.thumbKey);
    }
    await ctx.knex.transaction((trx) => repo.insertPhotos(trx, rows));
  } catch (err) {
    // Nothing half-stored: files written before the failure go too (retried if they resist).
    await storedFiles.discard(ctx, written);
    throw err;
  }
  const all = await repo.listPhotos(
    ctx.knex,
    buildId,
    target.stepId ? { stepId: target.stepId } : { partId: target.partId! },
    'asc',
  );
  const byId = new Map(all.map((p) => [p.id, p]));
  return rows.map((r) => repo.present(byId.get(r.id)!));
}

/** Owner and crew caption any photo; a shop only the photos it uploaded (canCaptionPhoto). */
export async function updateCaption(
  knex: Knex,
  buildId: string,
  rawPhotoId: string,
  caller: Caller,
  input: UpdatePhotoInput,
) {
  const photo = await load(knex, buildId, rawPhotoId, caller);
  if (!canCaptionPhoto(caller.role, caller.userId, photo)) {
    throw new ForbiddenError('A shop can caption only the photos it uploaded');
  }
  await repo.updateCaption(knex, photo.id, input.caption);
  return get(knex, buildId, photo.id, caller);
}

/** Owner only: the row goes and its files are queued with it, then removed. */
export async function remove(ctx: Ctx, buildId: string, rawPhotoId: string, caller: Caller) {
  const photo = await load(ctx.knex, buildId, rawPhotoId, caller);
  await repo.deletePhoto(ctx.knex, photo.id);
  await storedFiles.purgeSoon(ctx);
}
