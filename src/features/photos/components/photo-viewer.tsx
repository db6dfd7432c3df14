import { useId, useRef, useState, type ReactNode } from 'react';
import { ChevronLeft, ChevronRight, Pencil, Trash2, X } from 'lucide-react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import type { z } from 'zod';
import { updatePhotoInputSchema, type Photo } from '@shared/schemas/photos';
import { Button } from '@/components/ui/button';
import { ConfirmDialog } from '@/components/ui/confirm-dialog';
import { FormError } from '@/components/ui/form-error';
import { TextInput } from '@/components/ui/form-field';
import { useModalDialog } from '@/components/ui/modal';
import { applyServerErrors } from '@/lib/form-errors';
import { useDeletePhoto } from '../api/delete-photo';
import { useUpdatePhoto } from '../api/update-photo';
import { formatWhen } from '@/lib/dates';

type CaptionInput = z.input<typeof updatePhotoInputSchema>;
type CaptionValues = z.output<typeof updatePhotoInputSchema>;

function CaptionForm({
  buildId,
  photo,
  onDone,
}: {
  buildId: string;
  photo: Photo;
  onDone: () => void;
}) {
  const update = useUpdatePhoto();
  const id = useId();
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors, isSubmitting },
  } = useForm<CaptionInput, unknown, CaptionValues>({
    resolver: zodResolver(updatePhotoInputSchema),
    defaultValues: { caption: photo.caption },
  });
  const submit = handleSubmit(async (input) => {
    try {
      await update.mutateAsync({ buildId, photoId: photo.id, input });
      onDone();
    } catch (error) {
      applyServerErrors(error, setError, ['caption']);
    }
  });
  return (
    <form onSubmit={submit} noValidate className="flex flex-col gap-2">
      <label htmlFor={id} className="text-[15px] font-semibold text-white">
        Caption
      </label>
      <TextInput
        id={id}
        {...register('caption')}
        autoComplete="off"
        autoFocus
        className="min-h-12!"
      />
      {errors.caption?.message && (
        <p className="text-sm font-semibold text-[#ffb4a8]">{errors.caption.message}</p>
      )}
      <FormError message={errors.root?.server?.message} />
      <div className="flex gap-2">
        <Button type="submit" className="min-h-12!" pending={isSubmitting}>
          Save caption
        </Button>
        <Button variant="on-ink" className="min-h-12!" onClick={onDone}>
          Cancel
        </Button>
      </div>
    </form>
  );
}

/** The larger view of one photo, with the ones beside it a swipe of a button away. */
export function PhotoViewer({
  buildId,
  photos,
  index,
  onIndex,
  onClose,
  canCaption,
  canDelete,
  context,
}: {
  buildId: string;
  photos: Photo[];
  /** The open photo, or null when closed. */
  index: number | null;
  onIndex: (index: number) => void;
  onClose: () => void;
  canCaption: (photo: Photo) => boolean;
  canDelete: boolean;
  context?: (photo: Photo) => ReactNode;
}) {
  const titleId = useId();
  const remove = useDeletePhoto();
  const [editing, setEditing] = useState(false);
  const [deleting, setDeleting] = useState(false);
  const touchX = useRef<number | null>(null);
  const open = index !== null && photos.length > 0;
  const at = index === null ? 0 : Math.min(index, photos.length - 1);
  const photo = open ? photos[at] : undefined;
  const ref = useModalDialog(open);

  const go = (delta: number) => {
    if (!open) return;
    setEditing(false);
    onIndex((at + delta + photos.length) % photos.length);
  };

  return (
    <dialog
      ref={ref}
      aria-labelledby={titleId}
      onClose={() => {
        setEditing(false);
        onClose();
      }}
      onKeyDown={(e) => {
        if (editing || deleting) return;
        if (e.key === 'ArrowLeft') go(-1);
        if (e.key === 'ArrowRight') go(1);
      }}
      className="m-0 h-dvh max-h-none w-full max-w-none bg-[#111418] p-0 text-white backdrop:bg-black/80"
    >
      {photo && (
        <div className="mx-auto flex min-h-full max-w-6xl flex-col">
          <div className="flex items-center justify-between gap-2 px-3 py-2">
            <h2 id={titleId} className="min-w-0 truncate text-lg font-semibold">
              Photo {at + 1} of {photos.length}
            </h2>
            <button
              type="button"
              onClick={() => ref.current?.close()}
              aria-label="Close the photo"
              className="inline-flex size-12 shrink-0 items-center justify-center rounded-md hover:bg-white/10"
            >
              <X aria-hidden className="size-7" />
            </button>
          </div>

          <div
            className="relative flex flex-1 items-center justify-center px-2"
            onTouchStart={(e) => {
              touchX.current = e.touches[0]?.clientX ?? null;
            }}
            onTouchEnd={(e) => {
              const start = touchX.current;
              const end = e.changedTouches[0]?.clientX;
              touchX.current = null;
              // A sideways swipe of a thumb's width moves to the next or previous photo.
              if (start != null && end != null && Math.abs(end - start) > 60) {
                go(end < start ? 1 : -1);
              }
            }}
          >
            <img
              key={photo.id}
              src={photo.web.url}
              alt={photo.caption || `Photo ${at + 1}`}
              width={photo.web.width}
              height={photo.web.height}
              className="max-h-[68dvh] w-auto max-w-full object-contain"
            />
            {photos.length > 1 && (
              <>
                <button
                  type="button"
                  onClick={() => go(-1)}
                  aria-label="Previous photo"
                  className="absolute top-1/2 left-1 inline-flex size-12 -translate-y-1/2 items-center justify-center rounded-full bg-black/55 hover:bg-black/75"
                >
                  <ChevronLeft aria-hidden className="size-7" />
                </button>
                <button
                  type="button"
                  onClick={() => go(1)}
                  aria-label="Next photo"
                  className="absolute top-1/2 right-1 inline-flex size-12 -translate-y-1/2 items-center justify-center rounded-full bg-black/55 hover:bg-black/75"
                >
                  <ChevronRight aria-hidden className="size-7" />
                </button>
              </>
            )}
          </div>

          <div className="flex flex-col gap-3 px-4 py-4">
            {editing ? (
              <CaptionForm buildId={buildId} photo={photo} onDone={() => setEditing(false)} />
            ) : (
              <div className="flex flex-col gap-1">
                {photo.caption && (
                  <p className="text-lg font-semibold break-words">{photo.caption}</p>
                )}
                {context?.(photo)}
                <p className="text-sm text-white/75">
                  {photo.uploadedBy?.name ?? 'Someone'}, {formatWhen(photo.createdAt)} ·{' '}
                  {photo.original.width}×{photo.original.height}
                </p>
              </div>
            )}
            {!editing && (canCaption(photo) || canDelete) && (
              <div className="flex flex-wrap gap-2">
                {canCaption(photo) && (
                  <Button
                    variant="on-ink"
                    className="min-h-12!"
                    icon={<Pencil aria-hidden className="size-4" />}
                    onClick={() => setEditing(true)}
                  >
                    {photo.caption ? 'Edit caption' : 'Add a caption'}
                  </Button>
                )}
                {canDelete && (
                  <Button
                    variant="danger"
                    className="min-h-12!"
                    icon={<Trash2 aria-hidden className="size-4" />}
                    onClick={() => {
                      remove.reset();
                      setDeleting(true);
                    }}
                  >
                    Delete photo
                  </Button>
                )}
              </div>
            )}
          </div>
        </div>
      )}

      <ConfirmDialog
        open={deleting}
        title="Delete this photo?"
        confirmLabel="Delete the photo"
        pending={remove.isPending}
        onClose={() => setDeleting(false)}
        onConfirm={() => {
          if (!photo) return;
          remove.mutate(
            { buildId, photoId: photo.id },
            {
              onSuccess: () => {
                setDeleting(false);
                if (photos.length <= 1) ref.current?.close();
                else if (at === photos.length - 1) onIndex(at - 1);
              },
            },
          );
        }}
      >
        {photo?.caption ? `“${photo.caption}” is` : 'It is'} removed for everyone on the build, both
        sizes. This cannot be undone.
        {remove.isError && (
          <p role="alert" className="mt-2 font-semibold text-over">
            {remove.error.message}
          </p>
        )}
      </ConfirmDialog>
    </dialog>
  );
}
