/**
 * Photos on a build's public page: only those the owner marked public. Which
 * page may show them (a share switched on, with photos shown) is the sharing
 * feature's question; this answers which photos and their bytes.
 */
import type { Knex } from 'knex';
import type { PhotoSize } from '@shared/schemas/photos';
import { NotFoundError } from '@server/lib/errors';
import { parseId } from '@server/lib/scope';
import * as repo from './photos.repository';
import type { Ctx } from './photos.service';

/** A public photo as the sharing feature needs it: no storage keys, no uploader. */
export type PublicPhoto = {
  id: string;
  caption: string;
  web: { width: number; height: number };
  thumb: { width: number; height: number };
};

const toPublic = (p: repo.PhotoRecord): PublicPhoto => ({
  id: p.id,
  caption: p.caption,
  web: { width: p.web.width, height: p.web.height },
  thumb: { width: p.thumb.width, height: p.thumb.height },
});

export async function listPublic(knex: Knex, buildId: string): Promise<PublicPhoto[]> {
  return (await repo.listPublicPhotos(knex, buildId)).map(toPublic);
}

export async function publicIds(knex: Knex, buildId: string): Promise<string[]> {
  return (await repo.listPublicPhotos(knex, buildId)).map((p) => p.id);
}

/** Whether a photo of the build is public now (a cover must be). */
export async function isPublic(knex: Knex, buildId: string, photoId: string) {
  return Boolean(await repo.findPublicPhoto(knex, buildId, photoId));
}

/** The owner marks a photo of the build public or private; 404 for any other id. */
export async function setPublic(knex: Knex, buildId: string, rawPhotoId: string, value: boolean) {
  const id = parseId(rawPhotoId, 'Photo');
  if (!(await repo.setPublic(knex, buildId, id, value))) throw new NotFoundError('Photo not found');
  return { id, public: value };
}

/** The bytes of a public photo; a private or unknown one is not found. */
export async function publicFile(ctx: Ctx, buildId: string, rawPhotoId: string, size: PhotoSize) {
  const photo = await repo.findPublicPhoto(ctx.knex, buildId, parseId(rawPhotoId, 'Photo'));
  if (!photo) throw new NotFoundError('Photo not found');
  const data = await ctx.storage.get(size === 'web' ? photo.webKey : photo.thumbKey);
  if (!data) {
    ctx.logger.error({ photoId: photo.id, size }, 'photo file missing from storage');
    throw new NotFoundError('Photo file not found');
  }
  return { data, contentType: photo.web.contentType, id: photo.id };
}
