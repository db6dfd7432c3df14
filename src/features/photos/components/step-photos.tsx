import { useState } from 'react';
import { Camera } from 'lucide-react';
import type { Photo } from '../../../../shared/schemas/photos';
import { Spinner } from '../../../components/ui/spinner';
import { useStepPhotos } from '../api/get-step-photos';
import { PhotoGrid } from './photo-grid';
import { PhotoUploader } from './photo-uploader';
import { PhotoViewer } from './photo-viewer';

/** A step's photos: the uploader for those who may add, and the step's gallery. */
export function StepPhotos({
  buildId,
  stepId,
  canUpload,
  canCaption,
  canDelete,
}: {
  buildId: string;
  stepId: string;
  canUpload: boolean;
  canCaption: (photo: Photo) => boolean;
  canDelete: boolean;
}) {
  const photos = useStepPhotos(buildId, stepId);
  const [open, setOpen] = useState<number | null>(null);
  return (
    <section aria-labelledby="step-photos-title" className="rounded-lg border border-rule bg-sheet">
      <h2
        id="step-photos-title"
        className="flex items-center gap-2 border-b border-rule px-4 py-2.5 text-lg font-bold sm:px-5"
      >
        <Camera aria-hidden className="size-5 text-ink-3" />
        Photos
        {photos.data && photos.data.length > 0 && (
          <span className="font-semibold text-muted">({photos.data.length})</span>
        )}
      </h2>
      <div className="flex flex-col gap-4 px-4 py-4 sm:px-5">
        {canUpload && <PhotoUploader buildId={buildId} target={{ stepId }} />}
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
            No photos of this step yet.
            {canUpload && ' Before and after shots help with warranty claims.'}
          </p>
        ) : (
          <PhotoGrid label="Photos of this step" photos={photos.data} onOpen={setOpen} />
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
