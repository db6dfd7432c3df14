/** The only place the photos table is queried. */
import type { Knex } from 'knex';
import type { Photo, PhotoFormat } from '@shared/schemas/photos';

type PhotoRow = {
  id: string;
  build_id: string;
  step_id: string | null;
  part_id: string | null;
  caption: string;
  original_format: PhotoFormat;
  original_width: number;
  original_height: number;
  original_bytes: number;
  content_type: string;
  web_key: string;
  web_width: number;
  web_height: number;
  thumb_key: string;
  thumb_width: number;
  thumb_height: number;
  uploaded_by: string | null;
  uploaded_by_name: string | null;
  created_at: Date;
  updated_at: Date;
};

export type PhotoRecord = Photo & { webKey: string; thumbKey: string };

function toPhoto(r: PhotoRow): PhotoRecord {
  const base = `/api/builds/${r.build_id}/photos/${r.id}`;
  return {
    id: r.id,
    buildId: r.build_id,
    stepId: r.step_id,
    partId: r.part_id,
    caption: r.caption,
    original: {
      format: r.original_format,
      width: r.original_width,
      height: r.original_height,
      bytes: r.original_bytes,
    },
    web: {
      url: `${base}/web`,
      width: r.web_width,
      height: r.web_height,
      contentType: r.content_type,
    },
    thumb: {
      url: `${base}/thumb`,
      width: r.thumb_width,
      height: r.thumb_height,
      contentType: r.content_type,
    },
    uploadedBy: r.uploaded_by ? { id: r.uploaded_by, name: r.uploaded_by_name ?? '' } : null,
    createdAt: r.created_at.toISOString(),
    updatedAt: r.updated_at.toISOString(),
    webKey: r.web_key,
    thumbKey: r.thumb_key,
  };
}

/** The public shape: storage keys stay on the server. */
export function present(p: PhotoRecord): Photo {
  const { webKey: _w, thumbKey: _t, ...photo } = p;
  return photo;
}

function base(knex: Knex, buildId: string) {
  return knex('photos as ph')
    .leftJoin('users as u', 'u.id', 'ph.uploaded_by')
    .where('ph.build_id', buildId)
    .select('ph.*', 'u.display_name as uploaded_by_name');
}

export type PhotoFilter = {
  stepId?: string;
  partId?: string;
  /** For a shop: only photos of these steps or of parts sent to this shop. */
  shop?: { userId: string; stepIds: string[] };
};

export async function listPhotos(
  knex: Knex,
  buildId: string,
  filter: PhotoFilter,
  order: 'asc' | 'desc',
) {
  const q = base(knex, buildId).orderBy([
    { column: 'ph.created_at', order },
    { column: 'ph.id', order },
  ]);
  if (filter.stepId) q.where('ph.step_id', filter.stepId);
  if (filter.partId) q.where('ph.part_id', filter.partId);
  if (filter.shop) {
    const shop = filter.shop;
    q.where((w) =>
      w
        .whereIn('ph.step_id', shop.stepIds)
        .orWhereIn(
          'ph.part_id',
          knex('parts').where({ build_id: buildId, shop_user_id: shop.userId }).select('id'),
        ),
    );
  }
  const rows: PhotoRow[] = await q;
  return rows.map(toPhoto);
}

export async function findPhoto(knex: Knex, buildId: string, photoId: string) {
  const row: PhotoRow | undefined = await base(knex, buildId).where('ph.id', photoId).first();
  return row ? toPhoto(row) : undefined;
}

export type NewPhoto = {
  id: string;
  buildId: string;
  stepId: string | null;
  partId: string | null;
  caption: string;
  originalFormat: PhotoFormat;
  originalWidth: number;
  originalHeight: number;
  originalBytes: number;
  contentType: string;
  webKey: string;
  webWidth: number;
  webHeight: number;
  thumbKey: string;
  thumbWidth: number;
  thumbHeight: number;
  uploadedBy: string;
};

export async function insertPhotos(knex: Knex, photos: NewPhoto[]) {
  if (!photos.length) return;
  await knex('photos').insert(
    photos.map((p) => ({
      id: p.id,
      build_id: p.buildId,
      step_id: p.stepId,
      part_id: p.partId,
      caption: p.caption,
      original_format: p.originalFormat,
      original_width: p.originalWidth,
      original_height: p.originalHeight,
      original_bytes: p.originalBytes,
      content_type: p.contentType,
      web_key: p.webKey,
      web_width: p.webWidth,
      web_height: p.webHeight,
      thumb_key: p.thumbKey,
      thumb_width: p.thumbWidth,
      thumb_height: p.thumbHeight,
      uploaded_by: p.uploadedBy,
      // Per row, not per transaction: photos of one upload keep the order they were sent in.
      created_at: knex.raw('clock_timestamp()'),
      updated_at: knex.raw('clock_timestamp()'),
    })),
  );
}

export async function updateCaption(knex: Knex, photoId: string, caption: string) {
  await knex('photos').where({ id: photoId }).update({ caption, updated_at: knex.fn.now() });
}

/** Deletes rows and returns the storage keys their files live under. */
/** Deletes a photo row; its files are queued for removal by the database in the same statement. */
export async function deletePhoto(knex: Knex, photoId: string) {
  return knex('photos').where({ id: photoId }).delete();
}

// ---------------------------------------------------------------- public photos (sharing)

/** The build's photos the owner marked public, oldest first (the order of the work). */
export async function listPublicPhotos(knex: Knex, buildId: string) {
  const rows: PhotoRow[] = await base(knex, buildId)
    .where('ph.is_public', true)
    .orderBy([{ column: 'ph.created_at' }, { column: 'ph.id' }]);
  return rows.map(toPhoto);
}

/** A photo of the build, only when it is marked public. */
export async function findPublicPhoto(knex: Knex, buildId: string, photoId: string) {
  const row: PhotoRow | undefined = await base(knex, buildId)
    .where({ 'ph.id': photoId, 'ph.is_public': true })
    .first();
  return row ? toPhoto(row) : undefined;
}

/** Marks a photo of the build public or private; false when there is no such photo. */
export async function setPublic(knex: Knex, buildId: string, photoId: string, isPublic: boolean) {
  const changed = await knex('photos')
    .where({ id: photoId, build_id: buildId })
    .update({ is_public: isPublic, updated_at: knex.fn.now() });
  return changed > 0;
}
