import { useId, useState } from 'react';
import { Camera } from 'lucide-react';
import type { Photo } from '@shared/schemas/photos';
import { Spinner } from '@/components/ui/spinner';
import { useAttachedPhotos } from '../api/get-attached-photos';
import type { PhotoTarget } from '../api/upload-photo';
import { PhotoGrid } from './photo-grid';
import { PhotoUploader } from './photo-uploader';
import { PhotoViewer } from './photo-viewer';

/**
 * The photos of a step or a part: the uploader for those who may add, and the gallery.
 * `bare` drops the card frame, for use inside a dialog.
 */
export function AttachedPhotos({
  buildId,
  target,
  canUpload,
  canCaption,
  canDelete,
  bare = false,
}: {
  buildId: string;
  target: PhotoTarget;
  canUpload: boolean;
  canCaption: (photo: Photo) => boolean;
  canDelete: boolean;
  bare?: boolean;
}) {
  const photos = useAttachedPhotos(buildId, target);
  const [open, setOpen] = useState<number | null>(null);
  const titleId = useId();
  const of = 'stepId' in target ? 'this step' : 'this part';
  return (
    <section
      aria-labelledby={titleId}
      className={bare ? 'border-t border-rule pt-2' : 'rounded-lg border border-rule bg-sheet'}
    >
      <h2
        id={titleId}
        className="flex items-center gap-2 border-b border-rule px-4 py-2.5 text-lg font-bold sm:px-5"
      >
        <Camera aria-hidden className="size-5 text-ink-3" />
        Photos
        {photos.data && photos.data.length > 0 && (
          <span className="font-semibold text-muted">({photos.data.length})</span>
        )}
      </h2>
      <div className="flex flex-col gap-4 px-4 py-4 sm:px-5">
        {canUpload && <PhotoUploader buildId={buildId} target={target} />}
        {photos.isPending ? (
          <p role="status" className="flex items-center gap-2 text-muted">
            <Spinner className="size-5" /> Loading the photos…
          </p>
        ) : photos.isError ? (
          <p role="alert" className="font-semibold text-over">
            Could not load the photos: {photos.error.message}
          </p>
        ) : photos.data.length === 0 ? (
          <p className="text-muted">
            No photos of {of} yet.
            {canUpload && ' Before and after shots help with warranty claims.'}
          </p>
        ) : (
          <PhotoGrid label={`Photos of ${of}`} photos={photos.data} onOpen={setOpen} />
        )}
      </div>
      <PhotoViewer
        buildId={buildId}
        photos={photos.data ?? []}
        index={open}
        onIndex={setOpen}
        onClose={() => setOpen(null)}
        canCaption={canCaption}
        canDelete={canDelete}
      />
    </section>
  );
}
