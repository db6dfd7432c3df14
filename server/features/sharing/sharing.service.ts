/**
 * The owner's side of sharing: switch the public page on and off, choose what
 * it shows and which photos, and renew its address. And the visitor's side:
 * the share behind an address, read from the database on every request (no
 * process keeps one), so a switch-off or a new address takes effect at once
 * on every process.
 */
import type { Knex } from 'knex';
import {
  defaultShareSections,
  type ShareSettings,
  type UpdateShareInput,
} from '@shared/schemas/sharing';
import { NotFoundError, ValidationError } from '@server/lib/errors';
import { isTokenShaped, newToken } from '@server/lib/tokens';
import * as photos from '@server/features/photos';
import * as repo from './sharing.repository';
import { paths } from '@shared/paths';

export type ShareCtx = { knex: Knex; appUrl: string };

async function settingsOf(ctx: ShareCtx, buildId: string): Promise<ShareSettings> {
  const [share, publicPhotoIds] = await Promise.all([
    repo.findByBuild(ctx.knex, buildId),
    photos.publicIds(ctx.knex, buildId),
  ]);
  return {
    enabled: share?.enabled ?? false,
    token: share?.token ?? null,
    url: share ? ctx.appUrl + paths.shared.page.getHref(share.token) : null,
    sections: share?.sections ?? { ...defaultShareSections },
    showMemberNames: share?.showMemberNames ?? false,
    allowIndexing: share?.allowIndexing ?? false,
    coverPhotoId: share?.coverPhotoId ?? null,
    publicPhotoIds,
  };
}

export const getSettings = settingsOf;

/** Any of the settings; the share (and its address) is made on first use, switched off. */
export async function updateSettings(ctx: ShareCtx, buildId: string, input: UpdateShareInput) {
  if (input.coverPhotoId && !(await photos.isPublic(ctx.knex, buildId, input.coverPhotoId))) {
    throw new ValidationError('Choose a public photo of this build', {
      coverPhotoId: 'Mark the photo public first: link previews show only public photos',
    });
  }
  await ctx.knex.transaction(async (trx) => {
    await repo.ensureLocked(trx, buildId, newToken().token);
    await repo.updateShare(trx, buildId, input);
  });
  return settingsOf(ctx, buildId);
}

/** A new address; the old one answers 404 from now on, on every process. */
export async function regenerate(ctx: ShareCtx, buildId: string) {
  await ctx.knex.transaction(async (trx) => {
    await repo.ensureLocked(trx, buildId, newToken().token);
    await repo.updateShare(trx, buildId, { token: newToken().token });
  });
  return settingsOf(ctx, buildId);
}

/** Marks a photo public or private; a photo made private stops being the cover. */
export async function setPhotoVisibility(
  ctx: ShareCtx,
  buildId: string,
  rawPhotoId: string,
  value: boolean,
) {
  const photo = await photos.setPublic(ctx.knex, buildId, rawPhotoId, value);
  if (!value) await repo.clearCover(ctx.knex, buildId, photo.id);
  return photo;
}

/**
 * The share behind a public address while it is switched on, or 404 — the same
 * 404 for an address never made, renewed, or switched off. Text that is not
 * shaped like a token never reaches the database.
 */
export async function resolve(knex: Knex, token: string): Promise<repo.ShareRecord> {
  const share = isTokenShaped(token) ? await repo.findEnabledByToken(knex, token) : undefined;
  if (!share) throw new NotFoundError('This build is not shared, or its address has changed');
  return share;
}
