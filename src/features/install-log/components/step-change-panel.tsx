import { useState } from 'react';
import { useNavigate } from 'react-router-dom';
import { ArrowDown, ArrowUp, Pencil, Trash2 } from 'lucide-react';
import type { Step } from '@shared/schemas/install-log';
import { paths } from '@/config/paths';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { ConfirmDialog } from '@/components/ui/confirm-dialog';
import { Modal } from '@/components/ui/modal';
import { useDeleteStep } from '../api/delete-step';
import { useUpdateStep } from '../api/update-step';
import { StepForm } from './step-form';

type Props = {
  buildId: string;
  step: Step;
  /** The job's title, for the edit dialog. */
  jobTitle: string | undefined;
  /** How many steps the job has (0 while unknown): moving needs another step to swap with. */
  stepCount: number;
  canWrite: boolean;
  canDelete: boolean;
};

/** "Change this step": edit its name and text, move it within its job, delete it. */
export function StepChangePanel({
  buildId,
  step,
  jobTitle,
  stepCount,
  canWrite,
  canDelete,
}: Props) {
  const navigate = useNavigate();
  // Separate mutations, so each shows its own progress and error.
  const editStep = useUpdateStep();
  const moveStep = useUpdateStep();
  const deleteStep = useDeleteStep();
  const [editing, setEditing] = useState(false);
  const [confirmingDelete, setConfirmingDelete] = useState(false);
  const [moved, setMoved] = useState('');

  function move(position: number) {
    setMoved('');
    moveStep.mutate(
      { buildId, stepId: step.id, input: { position } },
      { onSuccess: (s) => setMoved(`Moved to step ${s.position} of ${stepCount}.`) },
    );
  }

  if (!canWrite && !canDelete) return null;
  return (
    <>
      <section
        aria-labelledby="change-step-title"
        className="flex flex-col gap-3 rounded-lg border border-rule bg-sheet px-4 py-3 sm:px-5"
      >
        <h2 id="change-step-title" className="text-lg font-bold">
          Change this step
        </h2>
        <div className="flex flex-wrap gap-2">
          {canWrite && (
            <Button
              variant="secondary"
              className="min-h-12!"
              icon={<Pencil aria-hidden className="size-5" />}
              onClick={() => setEditing(true)}
            >
              Edit name and what to do
            </Button>
          )}
          {canWrite && stepCount > 1 && (
            <>
              <Button
                variant="secondary"
                className="min-h-12!"
                icon={<ArrowUp aria-hidden className="size-5" />}
                disabled={step.position <= 1 || moveStep.isPending}
                onClick={() => move(step.position - 1)}
              >
                Move earlier
              </Button>
              <Button
                variant="secondary"
                className="min-h-12!"
                icon={<ArrowDown aria-hidden className="size-5" />}
                disabled={step.position >= stepCount || moveStep.isPending}
                onClick={() => move(step.position + 1)}
              >
                Move later
              </Button>
            </>
          )}
          {canDelete && (
            <Button
              variant="secondary"
              className="min-h-12! text-over!"
              icon={<Trash2 aria-hidden className="size-5" />}
              onClick={() => {
                deleteStep.reset();
                setConfirmingDelete(true);
              }}
            >
              Delete this step
            </Button>
          )}
        </div>
        <p role="status" className="text-[15px] text-ink-2 empty:hidden">
          {moved}
        </p>
        {moveStep.isError && <Alert tone="error">{moveStep.error.message}</Alert>}
      </section>

      <Modal
        open={editing}
        title="Edit the step"
        description={jobTitle}
        onClose={() => setEditing(false)}
        busy={editStep.isPending}
      >
        {editing && (
          <StepForm
            step={step}
            parts={undefined}
            submitLabel="Save the step"
            onCancel={() => setEditing(false)}
            onSubmit={async (input) => {
              await editStep.mutateAsync({ buildId, stepId: step.id, input });
              setEditing(false);
            }}
          />
        )}
      </Modal>

      <ConfirmDialog
        open={confirmingDelete}
        title="Delete this step?"
        confirmLabel="Delete the step"
        pending={deleteStep.isPending}
        onClose={() => setConfirmingDelete(false)}
        onConfirm={() =>
          deleteStep.mutate(
            { buildId, stepId: step.id },
            {
              onSuccess: () => {
                setConfirmingDelete(false);
                void navigate(paths.builds.install.getHref(buildId), { replace: true });
              },
            },
          )
        }
      >
        “{step.title}” goes with its checklist, torque specs, readings and photos
        {step.status === 'signed-off' ? ', and its sign-off' : ''}. This cannot be undone.
        {deleteStep.isError && (
          <p role="alert" className="mt-2 font-semibold text-over">
            {deleteStep.error.message}
          </p>
        )}
      </ConfirmDialog>
    </>
  );
}
