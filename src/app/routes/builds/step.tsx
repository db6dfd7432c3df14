import { useEffect, useState } from 'react';
import { useLocation, useNavigate, useParams } from 'react-router-dom';
import {
  ArrowDown,
  ArrowUp,
  ChevronLeft,
  ChevronRight,
  Pencil,
  Plus,
  Ruler,
  Trash2,
} from 'lucide-react';
import { canAddPhotosTo, canCaptionPhoto, capabilities } from '../../../../shared/permissions';
import type { Build } from '../../../../shared/schemas/builds';
import type { FastenerSpec, Step } from '../../../../shared/schemas/install-log';
import type { Photo } from '../../../../shared/schemas/photos';
import { paths } from '../../../config/paths';
import { PageHeader } from '../../../components/layouts/page-header';
import { Alert } from '../../../components/ui/alert';
import { Button, ButtonLink } from '../../../components/ui/button';
import { ConfirmDialog } from '../../../components/ui/confirm-dialog';
import { PageSpinner } from '../../../components/ui/spinner';
import { ErrorState, NotFoundState } from '../../../components/ui/states';
import { isApiError } from '../../../lib/api-client';
import { useUser } from '../../../lib/auth';
import { useBuild } from '../../../features/builds/api/get-build';
import { useCreateFastener } from '../../../features/install-log/api/create-fastener';
import { useDeleteFastener } from '../../../features/install-log/api/delete-fastener';
import { useDeleteStep } from '../../../features/install-log/api/delete-step';
import { useJobs } from '../../../features/install-log/api/get-jobs';
import { useStep } from '../../../features/install-log/api/get-step';
import { useUpdateFastener } from '../../../features/install-log/api/update-fastener';
import { useUpdateStep } from '../../../features/install-log/api/update-step';
import { CautionList } from '../../../features/install-log/components/cautions';
import { Checklist } from '../../../features/install-log/components/checklist';
import { FastenerCard } from '../../../features/install-log/components/fastener-card';
import { FastenerForm } from '../../../features/install-log/components/fastener-form';
import { LinkedParts } from '../../../features/install-log/components/linked-parts';
import { Modal } from '../../../components/ui/modal';
import { SignOffPanel } from '../../../features/install-log/components/sign-off-panel';
import { StepForm } from '../../../features/install-log/components/step-form';
import { StepStatusBadge } from '../../../features/install-log/components/step-status';
import { fastenerMode, stepPlace } from '../../../features/install-log/lib/step-place';
import { formatWhen } from '../../../lib/dates';
import { AttachedPhotos } from '../../../features/photos/components/attached-photos';
import { BuildLoadError } from './build-states';

/** "/builds/:buildId/install/steps/:stepId" — one step, made for a phone in the garage. */
export function StepRoute() {
  const { buildId = '', stepId = '' } = useParams();
  const build = useBuild(buildId);
  if (build.isPending) return <PageSpinner label="Loading the build…" />;
  if (build.isError) {
    return <BuildLoadError error={build.error} onRetry={() => void build.refetch()} />;
  }
  return <StepLoader build={build.data} stepId={stepId} />;
}

function StepLoader({ build, stepId }: { build: Build; stepId: string }) {
  const step = useStep(build.id, stepId);
  const back = (
    <ButtonLink to={paths.builds.install.getHref(build.id)} variant="secondary">
      Back to the install log
    </ButtonLink>
  );
  if (step.isPending) return <PageSpinner label="Loading the step…" />;
  if (step.isError) {
    if (isApiError(step.error) && step.error.status === 404) {
      return (
        <>
          <title>Step not found · Headroom</title>
          <NotFoundState title="Step not found" titleAs="h1" actions={back}>
            It may have been deleted, or it is not one you can see.
          </NotFoundState>
        </>
      );
    }
    return (
      <ErrorState
        title="Could not load this step"
        titleAs="h1"
        error={step.error}
        onRetry={() => void step.refetch()}
        actions={back}
      />
    );
  }
  return <StepPage build={build} step={step.data} />;
}

/**
 * A step opens at its top (the app keeps no scroll position between pages, and a phone
 * would otherwise land mid-page after the jobs list), and links into it (#fastener-…,
 * #check-… from the re-torque list and the blockers) land on their spot once it has drawn.
 */
function useScrollOnOpen(stepId: string) {
  const { hash } = useLocation();
  useEffect(() => {
    const target = hash ? document.getElementById(decodeURIComponent(hash.slice(1))) : null;
    if (target) target.scrollIntoView({ block: 'start' });
    else window.scrollTo(0, 0);
  }, [hash, stepId]);
}

function StepPage({ build, step }: { build: Build; step: Step }) {
  useScrollOnOpen(step.id);
  const me = useUser();
  const jobs = useJobs(build.id);
  const navigate = useNavigate();
  const updateStep = useUpdateStep();
  // Separate mutations, so each shows its own progress and error.
  const editStep = useUpdateStep();
  const moveStep = useUpdateStep();
  const deleteStep = useDeleteStep();
  const createFastener = useCreateFastener();
  const updateFastener = useUpdateFastener();
  const deleteFastener = useDeleteFastener();
  const [addingSpec, setAddingSpec] = useState(false);
  const [editingSpec, setEditingSpec] = useState<FastenerSpec | null>(null);
  const [deletingSpec, setDeletingSpec] = useState<FastenerSpec | null>(null);
  const [editingStep, setEditingStep] = useState(false);
  const [confirmingDelete, setConfirmingDelete] = useState(false);
  const [moved, setMoved] = useState('');

  const role = build.myRole;
  const {
    canWorkOnSteps: canWrite,
    canDeleteSteps: canDelete,
    canOverrideSignOff,
    canDeletePhotos,
  } = capabilities(role);
  const locked = step.status === 'signed-off';
  const editable = canWrite && !locked;

  const job = jobs.data?.find((j) => j.id === step.jobId);
  const index = job?.steps.findIndex((s) => s.id === step.id) ?? -1;
  const prev = job && index > 0 ? job.steps[index - 1] : undefined;
  const next = job && index >= 0 && index < job.steps.length - 1 ? job.steps[index + 1] : undefined;
  // Moving needs the job's step count, and another step to swap with.
  const stepCount = job && index >= 0 ? job.steps.length : 0;

  function move(position: number) {
    setMoved('');
    moveStep.mutate(
      { buildId: build.id, stepId: step.id, input: { position } },
      { onSuccess: (s) => setMoved(`Moved to step ${s.position} of ${stepCount}.`) },
    );
  }

  const canCaption = (photo: Photo) => canCaptionPhoto(role, me.id, photo);

  return (
    <>
      <title>{`${step.title} · Install · ${build.name} · Headroom`}</title>
      <PageHeader
        back={{ to: paths.builds.install.getHref(build.id), label: 'Install' }}
        title={step.title}
        subtitle={<span className="text-base">{stepPlace(step, job, role)}</span>}
        badges={<StepStatusBadge status={step.status} overridden={!!step.signOff?.override} />}
        actions={
          editable && step.status === 'not-started' ? (
            <Button
              variant="secondary"
              className="min-h-12!"
              pending={updateStep.isPending}
              onClick={() =>
                updateStep.mutate({
                  buildId: build.id,
                  stepId: step.id,
                  input: { status: 'under-way' },
                })
              }
            >
              Start this step
            </Button>
          ) : undefined
        }
      />

      <div className="flex flex-col gap-5">
        <CautionList cautions={step.cautions} />

        {locked && step.signOff && (
          <Alert
            tone={step.signOff.override ? 'warning' : 'ok'}
            title={`${step.signOff.override ? 'Signed off over open items' : 'Signed off'} by ${step.signOff.by?.name ?? 'someone'}`}
          >
            {formatWhen(step.signOff.at)}. Readings and ticks are locked
            {canWrite && step.fasteners.some((f) => f.retorque.asked && !f.retorque.closedAt)
              ? '; re-torque checks can still be recorded.'
              : '.'}
            {step.signOff.override && (
              <span className="mt-1 block">Why: “{step.signOff.override.reason}”</span>
            )}
          </Alert>
        )}
        {updateStep.isError && <Alert tone="error">{updateStep.error.message}</Alert>}

        {step.description && (
          <section
            aria-labelledby="step-description-title"
            className="rounded-lg border border-rule bg-sheet px-4 py-3 sm:px-5"
          >
            <h2 id="step-description-title" className="text-lg font-bold">
              What to do
            </h2>
            <p className="mt-1 text-[17px] whitespace-pre-line text-ink-2">{step.description}</p>
          </section>
        )}

        <LinkedParts buildId={build.id} parts={step.parts} />

        <Checklist
          buildId={build.id}
          stepId={step.id}
          items={step.checklist}
          canTick={editable}
          canAdd={editable}
          canDelete={canDelete && !locked}
        />

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
                onClick={() => setAddingSpec(true)}
              >
                Add a fastener spec
              </Button>
            )}
          </div>
          {step.fasteners.length === 0 ? (
            <p className="rounded-lg border border-dashed border-rule-strong bg-sheet/70 px-4 py-4 text-muted">
              No torque specs on this step.
              {editable &&
                ' Add one for each set of fasteners, copied from the service information.'}
            </p>
          ) : (
            step.fasteners.map((spec) => (
              <FastenerCard
                key={spec.id}
                buildId={build.id}
                spec={spec}
                mode={fastenerMode(step, spec, canWrite)}
                calibrationMonths={build.wrenchCalibrationMonths}
                onEdit={
                  editable
                    ? () => {
                        updateFastener.reset();
                        setEditingSpec(spec);
                      }
                    : undefined
                }
                onDelete={
                  canDelete && !locked
                    ? () => {
                        deleteFastener.reset();
                        setDeletingSpec(spec);
                      }
                    : undefined
                }
              />
            ))
          )}
        </section>

        <SignOffPanel step={step} canSignOff={canWrite} canOverride={canOverrideSignOff} />

        <AttachedPhotos
          buildId={build.id}
          target={{ stepId: step.id }}
          canUpload={canAddPhotosTo(role, 'step')}
          canCaption={canCaption}
          canDelete={canDeletePhotos}
        />

        {(canWrite || canDelete) && (
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
                  onClick={() => setEditingStep(true)}
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
        )}

        {(prev || next) && (
          <nav aria-label="Other steps of this job" className="grid grid-cols-2 gap-2">
            {prev ? (
              <ButtonLink
                to={paths.builds.step.getHref(build.id, prev.id)}
                variant="secondary"
                className="min-h-14! justify-start! text-left whitespace-normal!"
                icon={<ChevronLeft aria-hidden className="size-5 shrink-0" />}
              >
                <span className="min-w-0">
                  <span className="block text-sm font-normal text-muted">Previous step</span>
                  <span className="line-clamp-2">{prev.title}</span>
                </span>
              </ButtonLink>
            ) : (
              <span />
            )}
            {next && (
              <ButtonLink
                to={paths.builds.step.getHref(build.id, next.id)}
                variant="secondary"
                className="min-h-14! justify-end! text-right whitespace-normal!"
              >
                <span className="min-w-0">
                  <span className="block text-sm font-normal text-muted">Next step</span>
                  <span className="line-clamp-2">{next.title}</span>
                </span>
                <ChevronRight aria-hidden className="size-5 shrink-0" />
              </ButtonLink>
            )}
          </nav>
        )}
      </div>

      <Modal
        open={addingSpec}
        title="Add a fastener spec"
        description={step.title}
        onClose={() => setAddingSpec(false)}
        busy={createFastener.isPending}
      >
        <FastenerForm
          onCancel={() => setAddingSpec(false)}
          onSubmit={async (input) => {
            await createFastener.mutateAsync({ buildId: build.id, stepId: step.id, input });
            setAddingSpec(false);
          }}
        />
      </Modal>

      <Modal
        open={editingSpec !== null}
        title="Edit the fastener spec"
        description={editingSpec?.name}
        onClose={() => setEditingSpec(null)}
        busy={updateFastener.isPending}
      >
        {editingSpec && (
          <FastenerForm
            spec={editingSpec}
            canOverride={canOverrideSignOff}
            onCancel={() => setEditingSpec(null)}
            onSubmit={async (input) => {
              await updateFastener.mutateAsync({
                buildId: build.id,
                specId: editingSpec.id,
                input,
              });
              setEditingSpec(null);
            }}
          />
        )}
      </Modal>

      <Modal
        open={editingStep}
        title="Edit the step"
        description={job?.title}
        onClose={() => setEditingStep(false)}
        busy={editStep.isPending}
      >
        {editingStep && (
          <StepForm
            step={step}
            parts={undefined}
            submitLabel="Save the step"
            onCancel={() => setEditingStep(false)}
            onSubmit={async (input) => {
              await editStep.mutateAsync({ buildId: build.id, stepId: step.id, input });
              setEditingStep(false);
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
            { buildId: build.id, stepId: step.id },
            {
              onSuccess: () => {
                setConfirmingDelete(false);
                void navigate(paths.builds.install.getHref(build.id), { replace: true });
              },
            },
          )
        }
      >
        “{step.title}” goes with its checklist, torque specs, readings and photos
        {locked ? ', and its sign-off' : ''}. This cannot be undone.
        {deleteStep.isError && (
          <p role="alert" className="mt-2 font-semibold text-over">
            {deleteStep.error.message}
          </p>
        )}
      </ConfirmDialog>

      <ConfirmDialog
        open={deletingSpec !== null}
        title="Delete this fastener spec?"
        confirmLabel="Delete the spec"
        pending={deleteFastener.isPending}
        onClose={() => setDeletingSpec(null)}
        onConfirm={() => {
          if (!deletingSpec) return;
          deleteFastener.mutate(
            { buildId: build.id, stepId: step.id, specId: deletingSpec.id },
            { onSuccess: () => setDeletingSpec(null) },
          );
        }}
      >
        “{deletingSpec?.name}” goes with every reading recorded against it.
        {deleteFastener.isError && (
          <p role="alert" className="mt-2 font-semibold text-over">
            {deleteFastener.error.message}
          </p>
        )}
      </ConfirmDialog>
    </>
  );
}
