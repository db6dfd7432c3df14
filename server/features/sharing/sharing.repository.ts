/** The only place build_shares is queried. */
import type { Knex } from 'knex';
import { shareSections, type ShareSections } from '@shared/sharing/vocabulary';

type ShareRow = {
  build_id: string;
  token: string;
  enabled: boolean;
  show_member_names: boolean;
  allow_indexing: boolean;
  cover_photo_id: string | null;
  updated_at: Date;
} & Record<`show_${string}`, boolean>;

export type ShareRecord = {
  buildId: string;
  token: string;
  enabled: boolean;
  sections: ShareSections;
  showMemberNames: boolean;
  allowIndexing: boolean;
  coverPhotoId: string | null;
};

const sectionColumn = (s: string) => `show_${s}`;

function toShare(r: ShareRow): ShareRecord {
  return {
    buildId: r.build_id,
    token: r.token,
    enabled: r.enabled,
    sections: Object.fromEntries(
      shareSections.map((s) => [s, Boolean(r[sectionColumn(s) as `show_${string}`])]),
    ) as ShareSections,
    showMemberNames: r.show_member_names,
    allowIndexing: r.allow_indexing,
    coverPhotoId: r.cover_photo_id,
  };
}

export async function findByBuild(knex: Knex, buildId: string) {
  const row: ShareRow | undefined = await knex('build_shares').where({ build_id: buildId }).first();
  return row ? toShare(row) : undefined;
}

/** The share behind a public address, only while it is switched on. */
export async function findEnabledByToken(knex: Knex, token: string) {
  const row: ShareRow | undefined = await knex('build_shares')
    .where({ token, enabled: true })
    .first();
  return row ? toShare(row) : undefined;
}

/** Makes the build's share (switched off) unless it has one; locks it for the transaction. */
export async function ensureLocked(trx: Knex.Transaction, buildId: string, token: string) {
  await trx('build_shares').insert({ build_id: buildId, token }).onConflict('build_id').ignore();
  const row: ShareRow = await trx('build_shares').where({ build_id: buildId }).forUpdate().first();
  return toShare(row);
}

export type ShareChanges = Partial<{
  enabled: boolean;
  sections: Partial<ShareSections>;
  showMemberNames: boolean;
  allowIndexing: boolean;
  coverPhotoId: string | null;
  token: string;
}>;

export async function updateShare(knex: Knex, buildId: string, changes: ShareChanges) {
  const row: Record<string, unknown> = {};
  if (changes.enabled !== undefined) row.enabled = changes.enabled;
  if (changes.showMemberNames !== undefined) row.show_member_names = changes.showMemberNames;
  if (changes.allowIndexing !== undefined) row.allow_indexing = changes.allowIndexing;
  if (changes.coverPhotoId !== undefined) row.cover_photo_id = changes.coverPhotoId;
  if (changes.token !== undefined) row.token = changes.token;
  for (const [section, on] of Object.entries(changes.sections ?? {})) {
    if (on !== undefined) row[sectionColumn(section)] = on;
  }
  await knex('build_shares')
    .where({ build_id: buildId })
    .update({ ...row, updated_at: knex.fn.now() });
}

/** A photo made private stops being the cover. */
export async function clearCover(knex: Knex, buildId: string, photoId: string) {
  await knex('build_shares')
    .where({ build_id: buildId, cover_photo_id: photoId })
    .update({ cover_photo_id: null, updated_at: knex.fn.now() });
}
