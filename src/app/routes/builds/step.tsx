import { useEffect } from 'react';
import { useLocation, useParams } from 'react-router-dom';
import { canAddPhotosTo, canCaptionPhoto, capabilities } from '@shared/permissions';
import type { Build } from '@shared/schemas/builds';
import type { Step } from '@shared/schemas/install-log';
import type { Photo } from '@shared/schemas/photos';
import { paths } from '@/config/paths';
import { PageHeader } from '@/app/layouts/page-header';
import { Alert } from '@/components/ui/alert';
import { Button, ButtonLink } from '@/components/ui/button';
import { PageSpinner } from '@/components/ui/spinner';
import { ErrorState, NotFoundState } from '@/components/ui/states';
import { isApiError } from '@/lib/api-client';
import { useUser } from '@/lib/auth';
import { formatWhen } from '@/lib/dates';
import { useBuild } from '@/features/builds/api/get-build';
import { useJobs } from '@/features/install-log/api/get-jobs';
import { useStep } from '@/features/install-log/api/get-step';
import { useUpdateStep } from '@/features/install-log/api/update-step';
import { CautionList } from '@/features/install-log/components/cautions';
import { Checklist } from '@/features/install-log/components/checklist';
import { LinkedParts } from '@/features/install-log/components/linked-parts';
import { SignOffPanel } from '@/features/install-log/components/sign-off-panel';
import { StepChangePanel } from '@/features/install-log/components/step-change-panel';
import { StepNav } from '@/features/install-log/components/step-nav';
import { StepStatusBadge } from '@/features/install-log/components/step-status';
import { StepTorquePanel } from '@/features/install-log/components/step-torque-panel';
import { WaitingEntries } from '@/features/install-log/components/waiting-entries';
import { stepPlace } from '@/features/install-log/lib/step-place';
import { AttachedPhotos } from '@/features/photos/components/attached-photos';
import { BuildLoadError } from './build-states';

/** "/builds/:buildId/install/steps/:stepId" — one step, made for a phone in the garage. */
export function StepRoute() {
  const { buildId = '', stepId = '' } = useParams();
  const build = useBuild(buildId);
  if (build.isPending) return <PageSpinner label="Loading the build…" />;
  // Without signal, the copy saved on the device stands even when refreshing it failed.
  if (build.isError && !build.data) {
    return <BuildLoadError error={build.error} onRetry={() => void build.refetch()} />;
  }
  return <StepLoader build={build.data!} stepId={stepId} />;
}

function StepLoader({ build, stepId }: { build: Build; stepId: string }) {
  const step = useStep(build.id, stepId);
  const back = (
    <ButtonLink to={paths.builds.install.getHref(build.id)} variant="secondary">
      Back to the install log
    </ButtonLink>
  );
  if (step.isPending) return <PageSpinner label="Loading the step…" />;
  if (step.isError && (!step.data || (isApiError(step.error) && step.error.status === 404))) {
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
  return <StepPage build={build} step={step.data!} />;
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
  const updateStep = useUpdateStep();

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

        <WaitingEntries stepId={step.id} />

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

        <StepTorquePanel
          buildId={build.id}
          step={step}
          calibrationMonths={build.wrenchCalibrationMonths}
          canWrite={canWrite}
          editable={editable}
          canDeleteSpecs={canDelete && !locked}
          canOverride={canOverrideSignOff}
        />

        <SignOffPanel step={step} canSignOff={canWrite} canOverride={canOverrideSignOff} />

        <AttachedPhotos
          buildId={build.id}
          target={{ stepId: step.id }}
          canUpload={canAddPhotosTo(role, 'step')}
          canCaption={canCaption}
          canDelete={canDeletePhotos}
        />

        <StepChangePanel
          buildId={build.id}
          step={step}
          jobTitle={job?.title}
          stepCount={job && index >= 0 ? job.steps.length : 0}
          canWrite={canWrite}
          canDelete={canDelete}
        />

        <StepNav buildId={build.id} prev={prev} next={next} />
      </div>
    </>
  );
}
