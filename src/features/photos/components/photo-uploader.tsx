import { useEffect, useId, useRef, useState } from 'react';
import { Camera, CircleCheck, ImageOff, RotateCcw, Upload, X } from 'lucide-react';
import { defaultPhotoMaxBytes, photoAccept } from '@shared/schemas/photos';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { cn } from '@/components/ui/cn';
import { isApiError } from '@/lib/api-client';
import { isOffline } from '@/lib/offline-queue';
import { useUploadPhoto, type PhotoTarget } from '../api/upload-photo';
import { keepPhotoOffline } from '../lib/keep-offline';

type ItemState = 'ready' | 'waiting' | 'uploading' | 'processing' | 'done' | 'failed';

type Item = {
  key: string;
  file: File;
  preview: string;
  caption: string;
  state: ItemState;
  progress: number;
  error?: string;
  /** A dropped connection or a server fault may go through a second time; a refusal will not. */
  retryable?: boolean;
};

const maxMb = Math.round(defaultPhotoMaxBytes / 1024 / 1024);

function sizeText(bytes: number): string {
  if (bytes >= 1024 * 1024) return `${(bytes / 1024 / 1024).toFixed(1)} MB`;
  return `${Math.max(1, Math.round(bytes / 1024))} KB`;
}

/** What the browser can tell before sending; the server checks the content itself. */
function precheck(file: File): string | undefined {
  if (file.size > defaultPhotoMaxBytes) {
    return `Larger than ${maxMb} MB; this one cannot be added.`;
  }
  const heic = /\.(heic|heif)$/i.test(file.name);
  if (file.type && !file.type.startsWith('image/') && !heic) {
    return 'Not a photo: choose a JPEG, PNG, WebP or HEIC picture.';
  }
  return undefined;
}

let nextKey = 0;

/**
 * Choose several photos, caption each if you like, and send them: one request per file so
 * each has its own progress bar, one after another so a slow garage connection is not split.
 */
export function PhotoUploader({
  buildId,
  target,
  label = 'Add photos',
}: {
  buildId: string;
  target: PhotoTarget;
  label?: string;
}) {
  const upload = useUploadPhoto();
  const inputId = useId();
  const [items, setItems] = useState<Item[]>([]);
  const [sending, setSending] = useState(false);
  const [done, setDone] = useState<number | null>(null);
  const [kept, setKept] = useState(0);
  const itemsRef = useRef(items);
  useEffect(() => {
    itemsRef.current = items;
  }, [items]);

  // Previews are object URLs: let them go with the component.
  useEffect(
    () => () => {
      for (const item of itemsRef.current) URL.revokeObjectURL(item.preview);
    },
    [],
  );

  const patch = (key: string, change: Partial<Item>) =>
    setItems((list) => list.map((i) => (i.key === key ? { ...i, ...change } : i)));

  function add(files: FileList | null) {
    if (!files?.length) return;
    setDone(null);
    const added: Item[] = [...files].map((file) => {
      const error = precheck(file);
      return {
        key: `photo-${nextKey++}`,
        file,
        preview: URL.createObjectURL(file),
        caption: '',
        state: error ? 'failed' : 'ready',
        progress: 0,
        error,
      };
    });
    setItems((list) => [...list, ...added]);
  }

  function removeItem(key: string) {
    setItems((list) => {
      const gone = list.find((i) => i.key === key);
      if (gone) URL.revokeObjectURL(gone.preview);
      return list.filter((i) => i.key !== key);
    });
  }

  async function sendAll(only?: string) {
    const queue = items.filter((i) => (only ? i.key === only : i.state === 'ready'));
    if (!queue.length) return;
    setSending(true);
    setDone(null);
    for (const item of queue) patch(item.key, { state: 'waiting', error: undefined, progress: 0 });
    let ok = 0;
    let keptHere = 0;
    for (const item of queue) {
      patch(item.key, { state: 'uploading' });
      try {
        // No signal: resized and kept on the phone with the step's waiting entries.
        if (isOffline() && 'stepId' in target) {
          await keepPhotoOffline(buildId, target, item.file, item.caption.trim());
          patch(item.key, { state: 'done', progress: 1 });
          keptHere += 1;
          continue;
        }
        await upload.mutateAsync({
          buildId,
          target,
          file: item.file,
          caption: item.caption.trim() || undefined,
          onProgress: (fraction) =>
            patch(item.key, {
              progress: fraction,
              // All bytes sent: the server now checks, turns and resizes it.
              state: fraction >= 1 ? 'processing' : 'uploading',
            }),
        });
        patch(item.key, { state: 'done', progress: 1 });
        ok += 1;
      } catch (error) {
        patch(item.key, {
          state: 'failed',
          error: isApiError(error) ? error.message : 'The upload stopped. Try again.',
          retryable: !isApiError(error) || error.status === 0 || error.status >= 500,
        });
      }
    }
    setSending(false);
    // Uploaded photos now show in the gallery; keep only what still needs attention here.
    setItems((list) => {
      for (const i of list) if (i.state === 'done') URL.revokeObjectURL(i.preview);
      return list.filter((i) => i.state !== 'done');
    });
    setDone(ok);
    setKept(keptHere);
  }

  const ready = items.filter((i) => i.state === 'ready').length;

  return (
    <div className="flex flex-col gap-3">
      <div>
        <input
          id={inputId}
          type="file"
          multiple
          accept={photoAccept}
          className="peer sr-only"
          disabled={sending}
          onChange={(e) => {
            add(e.target.files);
            e.target.value = '';
          }}
        />
        <label
          htmlFor={inputId}
          className={cn(
            'inline-flex min-h-12 w-full cursor-pointer items-center justify-center gap-2 rounded-md border-2 border-dashed border-rule-strong bg-white px-4 text-base font-semibold text-ink',
            'peer-focus-visible:outline-3 peer-focus-visible:outline-offset-2 peer-focus-visible:outline-accent-500 hover:border-ink-3 sm:w-auto',
            sending && 'cursor-not-allowed opacity-60',
          )}
        >
          <Camera aria-hidden className="size-5" />
          {label}
        </label>
        <p className="mt-1 text-sm text-muted">
          JPEG, PNG, WebP or HEIC, up to {maxMb} MB each. Location and camera data are removed.
        </p>
      </div>

      {done !== null && kept > 0 && (
        <Alert tone="ok">
          {kept === 1 ? 'Photo kept' : `${kept} photos kept`} on this phone: waiting to send.
        </Alert>
      )}
      {done !== null && done > 0 && (
        <Alert tone="ok">{done === 1 ? 'Photo added.' : `${done} photos added.`}</Alert>
      )}

      {items.length > 0 && (
        <ul aria-label="Photos to upload" className="flex flex-col gap-2">
          {items.map((item) => (
            <UploadRow
              key={item.key}
              item={item}
              busy={sending}
              onCaption={(caption) => patch(item.key, { caption })}
              onRemove={() => removeItem(item.key)}
              onRetry={() => {
                patch(item.key, { state: 'ready', error: undefined });
                void sendAll(item.key);
              }}
            />
          ))}
        </ul>
      )}

      {ready > 0 && (
        <Button
          className="min-h-12! w-full sm:w-auto sm:self-start"
          pending={sending}
          icon={<Upload aria-hidden className="size-5" />}
          onClick={() => void sendAll()}
        >
          {ready === 1 ? 'Upload 1 photo' : `Upload ${ready} photos`}
        </Button>
      )}
    </div>
  );
}

function UploadRow({
  item,
  busy,
  onCaption,
  onRemove,
  onRetry,
}: {
  item: Item;
  busy: boolean;
  onCaption: (caption: string) => void;
  onRemove: () => void;
  onRetry: () => void;
}) {
  const [broken, setBroken] = useState(false);
  const captionId = useId();
  const pct = Math.round(item.progress * 100);
  const name = item.file.name || 'photo';
  return (
    <li
      className={cn(
        'flex gap-3 rounded-md border bg-white p-2',
        item.state === 'failed' ? 'border-over/60' : 'border-rule-strong',
      )}
    >
      <div className="flex size-20 shrink-0 items-center justify-center overflow-hidden rounded bg-paper">
        {broken ? (
          <ImageOff aria-hidden className="size-6 text-muted" />
        ) : (
          <img
            src={item.preview}
            alt=""
            className="size-full object-cover"
            onError={() => setBroken(true)}
          />
        )}
      </div>
      <div className="flex min-w-0 flex-1 flex-col gap-1.5">
        <div className="flex items-start justify-between gap-2">
          <p className="min-w-0 text-[15px] leading-snug">
            <span className="block truncate font-semibold">{name}</span>
            <span className="text-sm text-muted">{sizeText(item.file.size)}</span>
          </p>
          {(item.state === 'ready' || item.state === 'failed') && !busy && (
            <button
              type="button"
              onClick={onRemove}
              aria-label={`Remove ${name}`}
              className="-mt-1 -mr-1 inline-flex size-12 shrink-0 items-center justify-center rounded-md text-muted hover:bg-ink/5"
            >
              <X aria-hidden className="size-5" />
            </button>
          )}
        </div>

        {item.state === 'ready' && (
          <>
            <label htmlFor={captionId} className="sr-only">
              Caption for {name}
            </label>
            <input
              id={captionId}
              type="text"
              value={item.caption}
              maxLength={500}
              onChange={(e) => onCaption(e.target.value)}
              placeholder="Caption (optional)"
              autoComplete="off"
              className="block min-h-12 w-full rounded-md border border-rule-strong bg-white px-3 text-base"
            />
          </>
        )}

        {(item.state === 'waiting' ||
          item.state === 'uploading' ||
          item.state === 'processing') && (
          <div>
            <div
              role="progressbar"
              aria-label={`Uploading ${name}`}
              aria-valuemin={0}
              aria-valuemax={100}
              aria-valuenow={pct}
              className="h-3 overflow-hidden rounded-full bg-ink/10"
            >
              <div
                className="h-full rounded-full bg-accent-600 transition-[width]"
                style={{ width: `${pct}%` }}
              />
            </div>
            <p className="mt-1 text-sm text-muted tabular-nums">
              {item.state === 'waiting'
                ? 'Waiting…'
                : item.state === 'processing'
                  ? 'Sent; checking and resizing…'
                  : `${pct} %`}
            </p>
          </div>
        )}

        {item.state === 'done' && (
          <p className="flex items-center gap-1.5 text-sm font-semibold text-ok">
            <CircleCheck aria-hidden className="size-4" /> Uploaded
          </p>
        )}

        {item.state === 'failed' && (
          <div className="flex flex-col gap-1.5">
            <p role="alert" className="text-[15px] font-semibold text-over">
              {item.error}
            </p>
            {item.retryable && !busy && (
              <Button
                variant="secondary"
                size="sm"
                className="min-h-12! self-start"
                icon={<RotateCcw aria-hidden className="size-4" />}
                onClick={onRetry}
              >
                Try again
              </Button>
            )}
          </div>
        )}
      </div>
    </li>
  );
}
