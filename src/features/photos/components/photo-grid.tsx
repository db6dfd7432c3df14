import type { ReactNode } from 'react';
import type { Photo } from '@shared/schemas/photos';
import { formatWhen } from '@/lib/dates';

/** Thumbnails with their captions; each opens the larger view. */
export function PhotoGrid({
  photos,
  onOpen,
  context,
  label,
}: {
  photos: Photo[];
  onOpen: (index: number) => void;
  /** Where a photo belongs (a step, a part), shown under it in the build's gallery. */
  context?: (photo: Photo) => ReactNode;
  label: string;
}) {
  return (
    <ul aria-label={label} className="grid grid-cols-2 gap-3 sm:grid-cols-3 lg:grid-cols-4">
      {photos.map((photo, index) => (
        <li key={photo.id} className="flex min-w-0 flex-col">
          <button
            type="button"
            onClick={() => onOpen(index)}
            className="group block overflow-hidden rounded-md border border-rule bg-ink/5"
            aria-label={`Open ${photo.caption ? `“${photo.caption}”` : `photo ${index + 1}`}`}
          >
            <img
              src={photo.thumb.url}
              alt={photo.caption || `Photo ${index + 1}`}
              width={photo.thumb.width}
              height={photo.thumb.height}
              loading="lazy"
              className="aspect-[4/3] w-full object-cover transition-transform group-hover:scale-[1.02]"
            />
          </button>
          <div className="mt-1.5 min-w-0 text-[15px] leading-snug">
            {photo.caption && <p className="font-semibold break-words text-ink">{photo.caption}</p>}
            {context?.(photo)}
            <p className="text-sm text-muted">
              {photo.uploadedBy?.name ?? 'Someone'}, {formatWhen(photo.createdAt)}
            </p>
          </div>
        </li>
      ))}
    </ul>
  );
}
