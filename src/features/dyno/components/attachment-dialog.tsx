import { useId, useState } from 'react';
import { Paperclip } from 'lucide-react';
import { MAX_DYNO_ATTACHMENT_BYTES, type DynoRun } from '@shared/schemas/dyno';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { Modal } from '@/components/ui/modal';
import { useUploadDynoAttachment } from '../api/upload-dyno-attachment';

/** The dyno's own file (PDF, CSV or text) or a photo of its printout, on one run. */
export function AttachmentDialog({
  open,
  buildId,
  run,
  onClose,
}: {
  open: boolean;
  buildId: string;
  run: DynoRun;
  onClose: () => void;
}) {
  const upload = useUploadDynoAttachment();
  const [file, setFile] = useState<File | null>(null);
  const id = useId();
  const tooBig = file != null && file.size > MAX_DYNO_ATTACHMENT_BYTES;

  function close() {
    setFile(null);
    upload.reset();
    onClose();
  }

  return (
    <Modal
      open={open}
      onClose={close}
      busy={upload.isPending}
      title={`Attach a file to run ${run.runNumber}`}
      description="Checked by its content; members of the build can download it."
    >
      <div className="flex flex-col gap-4">
        {run.attachment && (
          <Alert tone="info">
            This replaces <strong>{run.attachment.name}</strong>.
          </Alert>
        )}
        <div className="flex flex-col gap-2 rounded-lg border border-rule bg-sheet p-4">
          <label htmlFor={id} className="font-semibold">
            File
          </label>
          <input
            id={id}
            type="file"
            accept=".pdf,.jpg,.jpeg,.png,.webp,.csv,.txt,application/pdf,image/jpeg,image/png,image/webp,text/csv,text/plain"
            disabled={upload.isPending}
            onChange={(e) => {
              upload.reset();
              setFile(e.target.files?.[0] ?? null);
            }}
            className="block min-h-11 w-full text-[15px] file:mr-3 file:min-h-11 file:cursor-pointer file:rounded-md file:border file:border-rule-strong file:bg-paper file:px-4 file:font-semibold file:text-ink"
          />
          <p className="text-sm text-muted">
            A PDF or text/CSV file exported from the dyno, or a photo of its printout (JPEG, PNG or
            WebP), at most 15 MB. Photos are kept without their location or camera data.
          </p>
        </div>
        {tooBig && <Alert tone="error">This file is larger than 15 MB.</Alert>}
        {upload.isError && (
          <Alert tone="error" title="Not attached">
            {upload.error.message}
          </Alert>
        )}
        <div className="flex flex-col-reverse gap-2 sm:flex-row sm:justify-end">
          <Button variant="secondary" onClick={close} disabled={upload.isPending}>
            Cancel
          </Button>
          <Button
            disabled={!file || tooBig}
            pending={upload.isPending}
            icon={<Paperclip aria-hidden className="size-5" />}
            onClick={() => {
              if (!file) return;
              upload.mutate({ buildId, runId: run.id, file }, { onSuccess: close });
            }}
          >
            Attach
          </Button>
        </div>
      </div>
    </Modal>
  );
}
