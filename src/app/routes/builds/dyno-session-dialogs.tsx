import { useNavigate } from 'react-router-dom';
import { can } from '@shared/permissions';
import type { Build } from '@shared/schemas/builds';
import type { DynoRun } from '@shared/schemas/dyno';
import { Alert } from '@/components/ui/alert';
import { ConfirmDialog } from '@/components/ui/confirm-dialog';
import type { useDeleteDynoRun } from '@/features/dyno/api/delete-dyno-run';
import type { useDeleteDynoSession } from '@/features/dyno/api/delete-dyno-session';
import type { DynoSessionAnswer } from '@/features/dyno/api/get-dyno-session';
import { AttachmentDialog } from '@/features/dyno/components/attachment-dialog';
import { ImportRunDialog } from '@/features/dyno/components/import-run';
import { RunFormDialog } from '@/features/dyno/components/run-form';
import { SessionFormDialog } from '@/features/dyno/components/session-form';

/* The dyno session page's dialogs: the session's form, a run's form, import, attach, deleting. */

export type Dialog =
  | { kind: 'edit-session' }
  | { kind: 'delete-session' }
  | { kind: 'new-run' }
  | { kind: 'import-run' }
  | { kind: 'edit-run'; run: DynoRun }
  | { kind: 'replace-curve'; run: DynoRun }
  | { kind: 'attach'; run: DynoRun }
  | { kind: 'delete-run'; run: DynoRun }
  | null;

export function SessionDialogs({
  dialog,
  onClose,
  build,
  session,
  runCount,
  backHref,
  deleteSession,
  deleteRun,
}: {
  dialog: Dialog;
  onClose: () => void;
  build: Build;
  session: DynoSessionAnswer['session'];
  runCount: number;
  /** Where deleting the session leaves for: the dyno days, with the chosen standard. */
  backHref: string;
  deleteSession: ReturnType<typeof useDeleteDynoSession>;
  deleteRun: ReturnType<typeof useDeleteDynoRun>;
}) {
  const navigate = useNavigate();
  return (
    <>
      <SessionFormDialog
        open={dialog?.kind === 'edit-session'}
        buildId={build.id}
        session={session}
        canAssign={can(build.myRole, 'dyno:assign')}
        onClose={onClose}
        onSaved={onClose}
      />
      <RunFormDialog
        open={dialog?.kind === 'new-run' || dialog?.kind === 'edit-run'}
        buildId={build.id}
        sessionId={session.id}
        run={dialog?.kind === 'edit-run' ? dialog.run : undefined}
        onClose={onClose}
        onSaved={onClose}
      />
      <ImportRunDialog
        open={dialog?.kind === 'import-run' || dialog?.kind === 'replace-curve'}
        buildId={build.id}
        sessionId={session.id}
        replace={dialog?.kind === 'replace-curve' ? dialog.run : undefined}
        onClose={onClose}
        onSaved={onClose}
      />
      {dialog?.kind === 'attach' && (
        <AttachmentDialog open buildId={build.id} run={dialog.run} onClose={onClose} />
      )}
      <ConfirmDialog
        open={dialog?.kind === 'delete-session'}
        title="Delete this dyno session?"
        confirmLabel="Yes, delete"
        pending={deleteSession.isPending}
        onClose={onClose}
        onConfirm={() =>
          deleteSession.mutate(
            { buildId: build.id, sessionId: session.id },
            {
              onSuccess: () => navigate(backHref, { replace: true }),
            },
          )
        }
      >
        <p>
          The session, its {runCount === 1 ? 'run' : `${runCount} runs`} and their attached files go
          for good.
        </p>
        {deleteSession.isError && (
          <Alert tone="error" className="mt-3">
            {deleteSession.error.message}
          </Alert>
        )}
      </ConfirmDialog>
      <ConfirmDialog
        open={dialog?.kind === 'delete-run'}
        title={
          dialog?.kind === 'delete-run' ? `Delete run ${dialog.run.runNumber}?` : 'Delete run?'
        }
        confirmLabel="Yes, delete"
        pending={deleteRun.isPending}
        onClose={onClose}
        onConfirm={() => {
          if (dialog?.kind !== 'delete-run') return;
          deleteRun.mutate({ buildId: build.id, runId: dialog.run.id }, { onSuccess: onClose });
        }}
      >
        <p>
          The run, its curve and its attached file go for good. The other runs keep their numbers.
        </p>
        {deleteRun.isError && (
          <Alert tone="error" className="mt-3">
            {deleteRun.error.message}
          </Alert>
        )}
      </ConfirmDialog>
    </>
  );
}
