import { useId, useState } from 'react';
import { Download, FileText, ImageOff, Trash2, Upload } from 'lucide-react';
import {
  BENCH_ORIGINAL_MAX_BYTES,
  benchOriginalAccept,
  type BenchSheet,
} from '@shared/schemas/bench';
import { Alert } from '@/components/ui/alert';
import { Button, buttonClasses } from '@/components/ui/button';
import { cn } from '@/components/ui/cn';
import { ConfirmDialog } from '@/components/ui/confirm-dialog';
import { isApiError } from '@/lib/api-client';
import { formatWhen } from '@/lib/dates';
import { useDeleteBenchOriginal } from '../api/delete-bench-original';
import { useUploadBenchOriginal } from '../api/upload-bench-original';

const maxMb = BENCH_ORIGINAL_MAX_BYTES / 1024 / 1024;

function sizeText(bytes: number): string {
  if (bytes >= 1024 * 1024) return `${(bytes / 1024 / 1024).toFixed(1)} MB`;
  return `${Math.max(1, Math.round(bytes / 1024))} KB`;
}

/** What the browser can tell before sending; the server checks the content itself. */
function precheck(file: File): string | null {
  if (file.size > BENCH_ORIGINAL_MAX_BYTES) return `Larger than ${maxMb} MB: send a smaller file.`;
  const pdf = file.type === 'application/pdf' || /\.pdf$/i.test(file.name);
  const photo = file.type.startsWith('image/') || /\.(heic|heif)$/i.test(file.name);
  if (!pdf && !photo) return 'Choose a PDF or a photo of the sheet.';
  return null;
}

/**
 * The shop's own sheet, as it handed it over: a photo (shown here in its web copy; the full
 * size stays legible in the download) or a PDF. Those who may change the sheet attach or
 * replace it, with a progress bar.
 */
export function OriginalPanel({
  buildId,
  sheet,
  canAttach,
  canRemove,
}: {
  buildId: string;
  sheet: BenchSheet;
  canAttach: boolean;
  canRemove: boolean;
}) {
  const upload = useUploadBenchOriginal();
  const remove = useDeleteBenchOriginal();
  const inputId = useId();
  const [progress, setProgress] = useState<number | null>(null);
  const [error, setError] = useState<string | null>(null);
  const [done, setDone] = useState<string | null>(null);
  const [confirming, setConfirming] = useState(false);
  const [broken, setBroken] = useState(false);
  const original = sheet.original;

  async function send(file: File) {
    setError(null);
    setDone(null);
    const refused = precheck(file);
    if (refused) {
      setError(refused);
      return;
    }
    setProgress(0);
    try {
      await upload.mutateAsync({
        buildId,
        sheetId: sheet.id,
        file,
        onProgress: (f) => setProgress(f),
      });
      setBroken(false);
      setDone(`Attached “${file.name}”.`);
    } catch (e) {
      setError(isApiError(e) ? e.message : 'The upload stopped. Try again.');
    } finally {
      setProgress(null);
    }
  }

  const pct = progress === null ? 0 : Math.round(progress * 100);
  return (
    <div className="flex flex-col gap-4">
      {original ? (
        <div className="flex flex-col gap-3">
          {original.webUrl ? (
            <a href={original.url} download className="block max-w-xl">
              {broken ? (
                <span className="flex h-40 items-center justify-center rounded-md border border-rule bg-paper text-muted">
                  <ImageOff aria-hidden className="size-6" />
                </span>
              ) : (
                <img
                  src={original.webUrl}
                  alt={`The original sheet “${sheet.occasion}” as the shop handed it over`}
                  width={original.width ?? undefined}
                  height={original.height ?? undefined}
                  className="h-auto w-full rounded-md border border-rule bg-white"
                  onError={() => setBroken(true)}
                />
              )}
            </a>
          ) : (
            <p className="flex items-center gap-2 text-ink-2">
              <FileText aria-hidden className="size-8 shrink-0 text-ink-3" />
              <span className="min-w-0 break-words">
                <span className="font-semibold text-ink">{original.fileName}</span> (PDF,{' '}
                {sizeText(original.bytes)})
              </span>
            </p>
          )}
          <p className="text-sm text-muted">
            {original.fileName} · {sizeText(original.bytes)}
            {original.width && original.height && ` · ${original.width} × ${original.height} px`}
            {original.uploadedBy && ` · attached by ${original.uploadedBy.name}`} ·{' '}
            {formatWhen(original.createdAt)}
          </p>
          <div className="flex flex-wrap gap-2">
            <a href={original.url} download className={buttonClasses('secondary', 'md')}>
              <Download aria-hidden className="size-4" />
              {original.format === 'pdf' ? 'Download the PDF' : 'Download the full-size original'}
            </a>
            {canRemove && (
              <Button
                variant="ghost"
                icon={<Trash2 aria-hidden className="size-4" />}
                onClick={() => {
                  remove.reset();
                  setConfirming(true);
                }}
              >
                Remove
              </Button>
            )}
          </div>
        </div>
      ) : (
        <p className="text-muted">
          No original attached.
          {canAttach &&
            ' A photo or a PDF of the shop’s own printout lets anyone check the numbers.'}
        </p>
      )}

      {canAttach && (
        <div className="flex flex-col gap-2">
          <input
            id={inputId}
            type="file"
            accept={benchOriginalAccept}
            className="peer sr-only"
            disabled={progress !== null}
            onChange={(e) => {
              const file = e.target.files?.[0];
              e.target.value = '';
              if (file) void send(file);
            }}
          />
          <label
            htmlFor={inputId}
            className={cn(
              'inline-flex min-h-12 w-full cursor-pointer items-center justify-center gap-2 rounded-md border-2 border-dashed border-rule-strong bg-white px-4 text-base font-semibold text-ink sm:w-auto sm:self-start',
              'peer-focus-visible:outline-3 peer-focus-visible:outline-offset-2 peer-focus-visible:outline-accent-500 hover:border-ink-3',
              progress !== null && 'cursor-not-allowed opacity-60',
            )}
          >
            <Upload aria-hidden className="size-5" />
            {original ? 'Replace the original sheet' : 'Attach the original sheet'}
          </label>
          <p className="text-sm text-muted">
            A PDF, or a photo (JPEG, PNG, WebP or HEIC), up to {maxMb} MB. Photos are kept at full
            size with their location and camera data removed.
          </p>
          {progress !== null && (
            <div>
              <div
                role="progressbar"
                aria-label="Uploading the original sheet"
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
                {pct >= 100 ? 'Sent; checking the file…' : `${pct} %`}
              </p>
            </div>
          )}
        </div>
      )}
      {error && <Alert tone="error">{error}</Alert>}
      {done && <Alert tone="ok">{done}</Alert>}

      <ConfirmDialog
        open={confirming}
        title="Remove the original sheet?"
        confirmLabel="Remove"
        pending={remove.isPending}
        onClose={() => setConfirming(false)}
        onConfirm={() =>
          remove.mutate(
            { buildId, sheetId: sheet.id },
            {
              onSuccess: () => {
                setConfirming(false);
                setDone('The original was removed.');
              },
            },
          )
        }
      >
        <p>The typed values stay. The file is deleted and cannot be brought back.</p>
        {remove.isError && (
          <Alert tone="error" className="mt-3">
            {isApiError(remove.error) ? remove.error.message : 'Could not remove it. Try again.'}
          </Alert>
        )}
      </ConfirmDialog>
    </div>
  );
}
