/**
 * Photo log rules. Every member reads the build's photos, except a shop, which
 * sees the photos of its own parts and of the steps linked to them. Owner and
 * crew add photos to steps and parts; a shop adds them to the parts sent to it.
 * An upload is all or nothing: every file is checked and converted before any
 * is stored.
 */
import { randomUUID } from 'node:crypto';
import type { Knex } from 'knex';
import type { Role } from '../../../shared/permissions';
import { idSchema } from '../../../shared/schemas/common';
import type { Photo, PhotoSize, UpdatePhotoInput } from '../../../shared/schemas/photos';
import { AppError, ForbiddenError, NotFoundError } from '../../lib/errors';
import type { Logger } from '../../lib/logger';
import type { Storage } from '../../lib/storage';
import * as installRepo from '../install-log/install-log.repository';
import { findPart } from '../parts/parts.repository';
import * as repo from './photos.repository';
import { processPhoto, type ProcessedPhoto } from './photos.images';

export type Caller = { userId: string; role: Role };
export type Ctx = { knex: Knex; storage: Storage; logger: Logger };
export type Subject = { stepId: string } | { partId: string };
export type UploadedFile = { path: string; originalname: string; size: number };

function parseId(raw: string, what: string) {
  const parsed = idSchema.safeParse(raw);
  if (!parsed.success) throw new NotFoundError(`${what} not found`);
  return parsed.data;
}

async function shopScope(knex: Knex, buildId: string, caller: Caller) {
  if (caller.role !== 'shop') return undefined;
  const stepIds = await installRepo.stepIdsForShop(knex, buildId, caller.userId);
  return { userId: caller.userId, stepIds: [...stepIds] };
}

/** The step or part a photo belongs to, checked against what the caller may see. */
async function loadSubject(knex: Knex, buildId: string, subject: Subject, caller: Caller) {
  if ('stepId' in subject) {
    const step = await installRepo.findStep(knex, buildId, parseId(subject.stepId, 'Step'));
    const shop = await shopScope(knex, buildId, caller);
    if (!step || (shop && !shop.stepIds.includes(step.id)))
      throw new NotFoundError('Step not found');
    return { stepId: step.id, partId: null };
  }
  const part = await findPart(knex, buildId, parseId(subject.partId, 'Part'));
  if (!part || (caller.role === 'shop' && part.shopUserId !== caller.userId))
    throw new NotFoundError('Part not found');
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
  const shop = await shopScope(knex, buildId, caller);
  if (shop) {
    const mine = photo.stepId
      ? shop.stepIds.includes(photo.stepId)
      : (await findPart(knex, buildId, photo.partId!))?.shopUserId === caller.userId;
    if (!mine) throw new NotFoundError('Photo not found');
  }
  return photo;
}

export async function get(knex: Knex, buildId: string, rawPhotoId: string, caller: Caller) {
  return repo.present(await load(knex, buildId, rawPhotoId, caller));
}

/** The bytes of one stored size, for the authenticated image routes. */
export async function file(
  ctx: Ctx,
  buildId: string,
  rawPhotoId: string,
  caller: Caller,
  size: PhotoSize,
) {
  const photo = await load(ctx.knex, buildId, rawPhotoId, caller);
  const data = await ctx.storage.get(size === 'web' ? photo.webKey : photo.thumbKey);
  if (!data) {
    ctx.logger.error({ photoId: photo.id, size }, 'photo file missing from storage');
    throw new NotFoundError('Photo file not found');
  }
  return { data, contentType: photo.web.contentType, photo };
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
  if (caller.role === 'shop' && target.stepId) {
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
    // Nothing half-stored: files written before the failure go too.
    for (const key of written) await ctx.storage.delete(key).catch(() => undefined);
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

/** Owner and crew caption any photo; a shop only the photos it uploaded. */
export async function updateCaption(
  knex: Knex,
  buildId: string,
  rawPhotoId: string,
  caller: Caller,
  input: UpdatePhotoInput,
) {
  const photo = await load(knex, buildId, rawPhotoId, caller);
  if (caller.role === 'shop' && photo.uploadedBy?.id !== caller.userId) {
    throw new ForbiddenError('A shop can caption only the photos it uploaded');
  }
  await repo.updateCaption(knex, photo.id, input.caption);
  return get(knex, buildId, photo.id, caller);
}

/** Removes stored files after their rows are gone; a file that will not go is logged, not fatal. */
export async function deleteFiles(ctx: Omit<Ctx, 'knex'>, keys: string[]) {
  for (const key of keys) {
    await ctx.storage
      .delete(key)
      .catch((err) => ctx.logger.error({ err, key }, 'could not delete a photo file'));
  }
}

/** Owner only: the row goes, then its files. */
export async function remove(ctx: Ctx, buildId: string, rawPhotoId: string, caller: Caller) {
  const photo = await load(ctx.knex, buildId, rawPhotoId, caller);
  const keys = await repo.deletePhotos(ctx.knex, { ids: [photo.id] });
  for (const key of keys) {
    await ctx.storage
      .delete(key)
      .catch((err) => ctx.logger.error({ err, key }, 'could not delete a photo file'));
  }
}
