import { Link } from 'react-router-dom';
import { Camera } from 'lucide-react';
import type { ShareSettings } from '@shared/schemas/sharing';
import { paths } from '@/config/paths';
import { Section } from '@/components/ui/card';
import { FormError } from '@/components/ui/form-error';
import { PageSpinner } from '@/components/ui/spinner';
import { useBuildPhotos } from '@/features/photos/api/get-build-photos';
import { useSetPhotoPublic } from '../api/set-photo-public';
import { useUpdateShare } from '../api/update-share';

/**
 * Which of the build's photos the public page shows (every photo is private until marked), and
 * which public photo a link preview shows.
 */
export function SharePhotos({ buildId, share }: { buildId: string; share: ShareSettings }) {
  const photos = useBuildPhotos(buildId);
  const mark = useSetPhotoPublic(buildId);
  const update = useUpdateShare(buildId);
  const isPublic = new Set(share.publicPhotoIds);
  const cover = share.coverPhotoId ?? share.publicPhotoIds[0] ?? null;

  return (
    <Section
      id="share-photos"
      title="Public photos"
      icon={<Camera aria-hidden className="size-5 text-ink-3" />}
    >
      <div className="flex flex-col gap-4">
        <p className="text-ink-2">
          Photos stay private until you mark them public.
          {!share.sections.photos && ' Photos are switched off above, so none shows for now.'} The
          preview photo is the one a link shows in a message or a post.
        </p>
        {photos.isPending ? (
          <PageSpinner label="Loading the photos…" />
        ) : photos.isError ? (
          <FormError message="Could not load the build’s photos. Reload the page to try again." />
        ) : photos.data.length === 0 ? (
          <p className="text-muted">
            No photos yet.{' '}
            <Link
              to={paths.builds.photos.getHref(buildId)}
              className="font-semibold text-accent-700 underline"
            >
              Add some on the Photos page
            </Link>
            .
          </p>
        ) : (
          <ul
            aria-label="The build’s photos"
            className="grid grid-cols-2 gap-3 sm:grid-cols-3 lg:grid-cols-4"
          >
            {photos.data.map((photo, index) => {
              const name = photo.caption || `Photo ${index + 1}`;
              return (
                <li key={photo.id} className="flex min-w-0 flex-col gap-1">
                  <img
                    src={photo.thumb.url}
                    alt={name}
                    width={photo.thumb.width}
                    height={photo.thumb.height}
                    loading="lazy"
                    className="aspect-[4/3] w-full rounded-md border border-rule object-cover"
                  />
                  {photo.caption && (
                    <p className="text-[15px] leading-snug font-semibold break-words">
                      {photo.caption}
                    </p>
                  )}
                  <label className="flex min-h-11 cursor-pointer items-center gap-2">
                    <input
                      type="checkbox"
                      className="size-5 shrink-0 accent-accent-600"
                      checked={isPublic.has(photo.id)}
                      aria-label={`Public: ${name}`}
                      onChange={(event) =>
                        mark.mutate({ photoId: photo.id, isPublic: event.target.checked })
                      }
                    />
                    <span aria-hidden>Public</span>
                  </label>
                  {isPublic.has(photo.id) && (
                    <label className="flex min-h-11 cursor-pointer items-center gap-2">
                      <input
                        type="radio"
                        name="share-cover"
                        className="size-5 shrink-0 accent-accent-600"
                        checked={cover === photo.id}
                        aria-label={`Preview photo: ${name}`}
                        onChange={() => update.mutate({ coverPhotoId: photo.id })}
                      />
                      <span aria-hidden>Preview photo</span>
                    </label>
                  )}
                </li>
              );
            })}
          </ul>
        )}
        <FormError message={mark.error?.message ?? update.error?.message} />
      </div>
    </Section>
  );
}
