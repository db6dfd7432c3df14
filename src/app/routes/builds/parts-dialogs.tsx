import { can, canAddPhotosTo, canCaptionPhoto, capabilities } from '@shared/permissions';
import type { Build } from '@shared/schemas/builds';
import type { Part, UpdatePartInput } from '@shared/schemas/parts';
import { Alert } from '@/components/ui/alert';
import { ConfirmDialog } from '@/components/ui/confirm-dialog';
import { Modal } from '@/components/ui/modal';
import { isApiError } from '@/lib/api-client';
import { useUser } from '@/lib/auth';
import { PartBenchSheets } from '@/features/bench/components/part-bench-sheets';
import type { useDeletePart } from '@/features/parts/api/delete-part';
import { PartForm } from '@/features/parts/components/part-form';
import { AttachedPhotos } from '@/features/photos/components/attached-photos';

/** The parts page's dialogs: a part's form (with its photos and bench sheets) and deleting one. */

export type Editing =
  { mode: 'create' } | { mode: 'edit' | 'progress'; part: Part; focusRating?: boolean } | null;

/** Add a part, edit one (owner), or change its status and dates (crew, shop). */
export function PartDialog({
  editing,
  build,
  shops,
  busy,
  onSubmit,
  onClose,
}: {
  editing: Editing;
  build: Build;
  shops: { userId: string; displayName: string }[];
  busy: boolean;
  onSubmit: (input: UpdatePartInput) => Promise<unknown>;
  onClose: () => void;
}) {
  const me = useUser();
  const role = build.myRole;
  const editingPart = editing && editing.mode !== 'create' ? editing.part : undefined;
  return (
    <Modal
      open={editing !== null}
      onClose={onClose}
      busy={busy}
      title={
        editing?.mode === 'create'
          ? 'Add a part'
          : editing?.mode === 'progress'
            ? `Status and dates: ${editingPart?.name ?? ''}`
            : `Edit ${editingPart?.name ?? 'part'}`
      }
      description={
        editing?.mode === 'progress'
          ? 'Your role may change where the part is and when; the owner edits the rest.'
          : undefined
      }
    >
      {editing && (
        <PartForm
          key={editingPart?.id ?? 'new'}
          mode={editing.mode}
          part={editingPart}
          currency={build.currency}
          shops={shops}
          submitLabel={editing.mode === 'create' ? 'Add part' : 'Save changes'}
          focusRating={editing.mode === 'edit' && editing.focusRating}
          onSubmit={onSubmit}
          onCancel={onClose}
        />
      )}
      {editingPart && (
        <div className="mt-5">
          <AttachedPhotos
            bare
            buildId={build.id}
            target={{ partId: editingPart.id }}
            canUpload={canAddPhotosTo(role, 'part')}
            canCaption={(photo) => canCaptionPhoto(role, me.id, photo)}
            canDelete={capabilities(role).canDeletePhotos}
          />
        </div>
      )}
      {editingPart?.category === 'fuel-injection' && (
        <div className="mt-5">
          <PartBenchSheets
            buildId={build.id}
            partId={editingPart.id}
            partName={editingPart.name}
            canAdd={can(role, 'bench:write')}
          />
        </div>
      )}
    </Modal>
  );
}

/** "Delete this part?", with the server's refusal if it answers one. */
export function DeletePartDialog({
  part,
  buildId,
  deletePart,
  onClose,
  onDeleted,
}: {
  part: Part | null;
  buildId: string;
  deletePart: ReturnType<typeof useDeletePart>;
  onClose: () => void;
  onDeleted: (name: string) => void;
}) {
  return (
    <ConfirmDialog
      open={part !== null}
      title={`Delete “${part?.name ?? ''}”?`}
      confirmLabel="Delete part"
      pending={deletePart.isPending}
      onClose={onClose}
      onConfirm={() => {
        if (!part) return;
        deletePart.mutate({ buildId, partId: part.id }, { onSuccess: () => onDeleted(part.name) });
      }}
    >
      <p>It leaves the ledger and the budget. This cannot be undone.</p>
      {deletePart.isError && (
        <Alert tone="error" className="mt-3">
          {isApiError(deletePart.error)
            ? deletePart.error.message
            : 'Could not delete it. Try again.'}
        </Alert>
      )}
    </ConfirmDialog>
  );
}
