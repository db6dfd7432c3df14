import { useState } from 'react';
import { Plus, Ruler } from 'lucide-react';
import type { FastenerSpec, Step } from '@shared/schemas/install-log';
import { Button } from '@/components/ui/button';
import { ConfirmDialog } from '@/components/ui/confirm-dialog';
import { Modal } from '@/components/ui/modal';
import { useCreateFastener } from '../api/create-fastener';
import { useDeleteFastener } from '../api/delete-fastener';
import { useUpdateFastener } from '../api/update-fastener';
import { fastenerMode } from '../lib/step-place';
import { FastenerCard } from './fastener-card';
import { FastenerForm } from './fastener-form';

type Props = {
  buildId: string;
  step: Step;
  calibrationMonths: number;
  /** May record readings (install:write). */
  canWrite: boolean;
  /** May add and edit specs: canWrite on an open step. */
  editable: boolean;
  /** May delete specs (install:delete, open step). */
  canDeleteSpecs: boolean;
  /** May change a target under readings (install:override). */
  canOverride: boolean;
};

/** The step's torque: a card per fastener spec, and the dialogs that add, edit and delete specs. */
export function StepTorquePanel({
  buildId,
  step,
  calibrationMonths,
  canWrite,
  editable,
  canDeleteSpecs,
  canOverride,
}: Props) {
  const createFastener = useCreateFastener();
  const updateFastener = useUpdateFastener();
  const deleteFastener = useDeleteFastener();
  const [adding, setAdding] = useState(false);
  const [editing, setEditing] = useState<FastenerSpec | null>(null);
  const [deleting, setDeleting] = useState<FastenerSpec | null>(null);

  return (
    <>
      <section aria-labelledby="torque-title" className="flex flex-col gap-3">
        <div className="flex flex-wrap items-center justify-between gap-2">
          <h2 id="torque-title" className="flex items-center gap-2 text-xl font-bold">
            <Ruler aria-hidden className="size-5 text-ink-3" />
            Torque
          </h2>
          {editable && (
            <Button
              variant="secondary"
              className="min-h-12!"
              icon={<Plus aria-hidden className="size-5" />}
              onClick={() => setAdding(true)}
            >
              Add a fastener spec
            </Button>
          )}
        </div>
        {step.fasteners.length === 0 ? (
          <p className="rounded-lg border border-dashed border-rule-strong bg-sheet/70 px-4 py-4 text-muted">
            No torque specs on this step.
            {editable && ' Add one for each set of fasteners, copied from the service information.'}
          </p>
        ) : (
          step.fasteners.map((spec) => (
            <FastenerCard
              key={spec.id}
              buildId={buildId}
              spec={spec}
              mode={fastenerMode(step, spec, canWrite)}
              calibrationMonths={calibrationMonths}
              onEdit={
                editable
                  ? () => {
                      updateFastener.reset();
                      setEditing(spec);
                    }
                  : undefined
              }
              onDelete={
                canDeleteSpecs
                  ? () => {
                      deleteFastener.reset();
                      setDeleting(spec);
                    }
                  : undefined
              }
            />
          ))
        )}
      </section>

      <Modal
        open={adding}
        title="Add a fastener spec"
        description={step.title}
        onClose={() => setAdding(false)}
        busy={createFastener.isPending}
      >
        <FastenerForm
          onCancel={() => setAdding(false)}
          onSubmit={async (input) => {
            await createFastener.mutateAsync({ buildId, stepId: step.id, input });
            setAdding(false);
          }}
        />
      </Modal>

      <Modal
        open={editing !== null}
        title="Edit the fastener spec"
        description={editing?.name}
        onClose={() => setEditing(null)}
        busy={updateFastener.isPending}
      >
        {editing && (
          <FastenerForm
            spec={editing}
            canOverride={canOverride}
            onCancel={() => setEditing(null)}
            onSubmit={async (input) => {
              await updateFastener.mutateAsync({ buildId, specId: editing.id, input });
              setEditing(null);
            }}
          />
        )}
      </Modal>

      <ConfirmDialog
        open={deleting !== null}
        title="Delete this fastener spec?"
        confirmLabel="Delete the spec"
        pending={deleteFastener.isPending}
        onClose={() => setDeleting(null)}
        onConfirm={() => {
          if (!deleting) return;
          deleteFastener.mutate(
            { buildId, stepId: step.id, specId: deleting.id },
            { onSuccess: () => setDeleting(null) },
          );
        }}
      >
        “{deleting?.name}” goes with every reading recorded against it.
        {deleteFastener.isError && (
          <p role="alert" className="mt-2 font-semibold text-over">
            {deleteFastener.error.message}
          </p>
        )}
      </ConfirmDialog>
    </>
  );
}
