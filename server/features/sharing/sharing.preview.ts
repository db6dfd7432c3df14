/**
 * What a link preview shows of a shared build (Open Graph title, description and
 * image), written into the HTML that Express sends: link previews run no script.
 */
import type { Knex } from 'knex';
import { powerBasisLabels } from '@shared/builds/vocabulary';
import { formatIsoDate, formatNumber } from '@shared/format';
import * as builds from '@server/features/builds';
import * as members from '@server/features/members';
import * as photos from '@server/features/photos';
import type { ShareRecord } from './sharing.repository';

export type Preview = {
  title: string;
  description: string;
  image: { url: string; width: number; height: number; alt: string } | null;
};

export async function previewOf(
  knex: Knex,
  share: ShareRecord,
  urls: { photo: (photoId: string) => string },
): Promise<Preview | null> {
  const ownerId = await members.anOwnerId(knex, share.buildId);
  if (!ownerId) return null;
  const build = await builds.get(knex, share.buildId, ownerId);
  let description = 'A diesel power build, shared on Headroom.';
  if (share.sections.summary) {
    const vehicle = [build.vehicleYear, build.vehicleDescription].filter(Boolean).join(' ');
    const target = `Target ${formatNumber(build.targetPowerHp, 0)} ${powerBasisLabels[build.targetPowerBasis]}`;
    const when = build.targetDate ? ` by ${formatIsoDate(build.targetDate, 'en-US')}` : '';
    const event = build.targetEvent ? ` for ${build.targetEvent}` : '';
    description = [vehicle, build.engineDescription, `${target}${when}${event}.`]
      .filter(Boolean)
      .join(' · ');
  }
  let image: Preview['image'] = null;
  if (share.sections.photos) {
    const list = await photos.listPublic(knex, share.buildId);
    const cover = list.find((p) => p.id === share.coverPhotoId) ?? list[0];
    if (cover) {
      image = {
        url: urls.photo(cover.id),
        width: cover.web.width,
        height: cover.web.height,
        alt: cover.caption || build.name,
      };
    }
  }
  return { title: build.name, description, image };
}
