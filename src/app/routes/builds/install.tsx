import { useEffect, useMemo, useState } from 'react';
import { useParams } from 'react-router-dom';
import { useQuery } from '@tanstack/react-query';
import { ClipboardList, Plus } from 'lucide-react';
import { can } from '@shared/permissions';
import type { Build } from '@shared/schemas/builds';
import type { Job } from '@shared/schemas/install-log';
import { PageHeader } from '@/app/layouts/page-header';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { ConfirmDialog } from '@/components/ui/confirm-dialog';
import { PageSpinner } from '@/components/ui/spinner';
import { EmptyState, ErrorState } from '@/components/ui/states';
import { useBuild } from '@/features/builds/api/get-build';
import { useCreateJob } from '@/features/install-log/api/create-job';
import { useCreateStep } from '@/features/install-log/api/create-step';
import { useDeleteJob } from '@/features/install-log/api/delete-job';
import { useJobs } from '@/features/install-log/api/get-jobs';
import { useRetorqueChecks } from '@/features/install-log/api/get-retorque-checks';
import { useUpdateJob } from '@/features/install-log/api/update-job';
import { CalibrationInterval } from '@/features/install-log/components/calibration-interval';
import { JobCard } from '@/features/install-log/components/job-card';
import { JobForm } from '@/features/install-log/components/job-form';
import { RetorqueChecks } from '@/features/install-log/components/retorque-checks';
import { Modal } from '@/components/ui/modal';
import { StepForm } from '@/features/install-log/components/step-form';
import { getPartsQueryOptions } from '@/features/parts/api/get-parts';
import { BuildLoadError } from './build-states';

/** "/builds/:buildId/install" — the jobs of a build, their steps and progress. */
export function InstallRoute() {
  const { buildId = '' } = useParams();
  const build = useBuild(buildId);
  if (build.isPending) return <PageSpinner label="Loading the build…" />;
  if (build.isError) {
    return <BuildLoadError error={build.error} onRetry={() => void build.refetch()} />;
  }
  return <InstallPage build={build.data} />;
}

function InstallPage({ build }: { build: Build }) {
  // The app keeps no scroll position between pages: open at the top, not where the last page was.
  useEffect(() => {
    window.scrollTo(0, 0);
  }, []);
  const jobs = useJobs(build.id);
  const checks = useRetorqueChecks(build.id, 'open');
  const createJob = useCreateJob();
  const createStep = useCreateStep();
  const updateJob = useUpdateJob();
  const deleteJob = useDeleteJob();
  const canWrite = can(build.myRole, 'install:write');
  const canDelete = can(build.myRole, 'install:delete');
  const [addingJob, setAddingJob] = useState(false);
  const [addingStepTo, setAddingStepTo] = useState<Job | null>(null);
  const [editingJob, setEditingJob] = useState<Job | null>(null);
  const [deletingJob, setDeletingJob] = useState<Job | null>(null);
  const [notice, setNotice] = useState<string | null>(null);
  const parts = useQuery({ ...getPartsQueryOptions(build.id), enabled: addingStepTo !== null });

  const totals = useMemo(() => {
    const steps = (jobs.data ?? []).flatMap((j) => j.steps);
    return {
      steps: steps.length,
      signedOff: steps.filter((s) => s.status === 'signed-off').length,
    };
  }, [jobs.data]);

  const newJobButton = canWrite && (
    <Button
      className="min-h-12!"
      icon={<Plus aria-hidden className="size-5" />}
      onClick={() => {
        setNotice(null);
        setAddingJob(true);
      }}
    >
      New job
    </Button>
  );

  let body;
  if (jobs.isPending) {
    body = <PageSpinner label="Loading the install log…" />;
  } else if (jobs.isError) {
    body = (
      <ErrorState
        title="Could not load the install log"
        error={jobs.error}
        onRetry={() => void jobs.refetch()}
      />
    );
  } else if (jobs.data.length === 0) {
    body = (
      <EmptyState
        icon={<ClipboardList aria-hidden className="size-6" />}
        title={build.myRole === 'shop' ? 'No steps for your parts yet' : 'No jobs yet'}
        actions={newJobButton || undefined}
      >
        {canWrite
          ? 'A job is a piece of the build, like “Fit the injectors”. Break it into steps; each step gets its checklist, torque specs, readings and photos.'
          : build.myRole === 'shop'
            ? 'Steps that fit the parts sent to your shop appear here.'
            : 'The owner and crew have not started the install log yet.'}
      </EmptyState>
    );
  } else {
    body = (
      <div className="flex flex-col gap-5">
        {jobs.data.map((job) => (
          <JobCard
            key={job.id}
            buildId={build.id}
            job={job}
            partial={build.myRole === 'shop'}
            onAddStep={
              canWrite
                ? () => {
                    setNotice(null);
                    setAddingStepTo(job);
                  }
                : undefined
            }
            onEdit={
              canWrite
                ? () => {
                    setNotice(null);
                    setEditingJob(job);
                  }
                : undefined
            }
            onDelete={
              canDelete
                ? () => {
                    setNotice(null);
                    deleteJob.reset();
                    setDeletingJob(job);
                  }
                : undefined
            }
          />
        ))}
      </div>
    );
  }

  return (
    <>
      <title>{`Install · ${build.name} · Headroom`}</title>
      <PageHeader
        title="Install"
        subtitle={
          <span>
            {build.name}
            {totals.steps > 0 && (
              <span className="text-muted">
                {' '}
                · {totals.signedOff} of {totals.steps} step{totals.steps === 1 ? '' : 's'} signed
                off
              </span>
            )}
          </span>
        }
        actions={jobs.data && jobs.data.length > 0 ? newJobButton : undefined}
      />

      <div className="flex flex-col gap-5">
        {notice && <Alert tone="ok">{notice}</Alert>}
        {checks.isError && (
          <Alert tone="error" title="Could not load the re-torque checks">
            {checks.error.message}
          </Alert>
        )}
        {checks.data && (
          <RetorqueChecks buildId={build.id} checks={checks.data} canWrite={canWrite} />
        )}
        {body}
        {build.myRole !== 'shop' && (
          <CalibrationInterval build={build} canChange={can(build.myRole, 'build:update')} />
        )}
      </div>

      <Modal
        open={addingJob}
        title="New job"
        description="Steps, specs and photos are added to it next."
        onClose={() => setAddingJob(false)}
        busy={createJob.isPending}
      >
        <JobForm
          onCancel={() => setAddingJob(false)}
          onSubmit={async (input) => {
            const job = await createJob.mutateAsync({ buildId: build.id, input });
            setAddingJob(false);
            setNotice(`Added the job “${job.title}”. Add its first step.`);
            setAddingStepTo(job);
          }}
        />
      </Modal>

      <Modal
        open={editingJob !== null}
        title="Edit the job"
        description={editingJob ? `“${editingJob.title}”` : undefined}
        onClose={() => setEditingJob(null)}
        busy={updateJob.isPending}
      >
        {editingJob && (
          <JobForm
            job={editingJob}
            submitLabel="Save the job"
            onCancel={() => setEditingJob(null)}
            onSubmit={async (input) => {
              const job = await updateJob.mutateAsync({
                buildId: build.id,
                jobId: editingJob.id,
                input,
              });
              setEditingJob(null);
              setNotice(`Saved the job “${job.title}”.`);
            }}
          />
        )}
      </Modal>

      <ConfirmDialog
        open={deletingJob !== null}
        title="Delete this job?"
        confirmLabel="Delete the job"
        pending={deleteJob.isPending}
        onClose={() => setDeletingJob(null)}
        onConfirm={() => {
          if (!deletingJob) return;
          const title = deletingJob.title;
          deleteJob.mutate(
            { buildId: build.id, jobId: deletingJob.id },
            {
              onSuccess: () => {
                setDeletingJob(null);
                setNotice(`Deleted the job “${title}”.`);
              },
            },
          );
        }}
      >
        {deletingJob && deletingJob.steps.length > 0 ? (
          <>
            “{deletingJob.title}” goes with{' '}
            {deletingJob.steps.length === 1 ? 'its step' : `its ${deletingJob.steps.length} steps`}{' '}
            and everything on them: checklists, torque specs, readings and photos. This cannot be
            undone.
          </>
        ) : (
          <>“{deletingJob?.title}” has no steps yet. This cannot be undone.</>
        )}
        {deleteJob.isError && (
          <p role="alert" className="mt-2 font-semibold text-over">
            {deleteJob.error.message}
          </p>
        )}
      </ConfirmDialog>

      <Modal
        open={addingStepTo !== null}
        title="Add a step"
        description={addingStepTo ? `To “${addingStepTo.title}”` : undefined}
        onClose={() => setAddingStepTo(null)}
        busy={createStep.isPending}
      >
        {addingStepTo && (
          <StepForm
            parts={parts.data}
            onCancel={() => setAddingStepTo(null)}
            onSubmit={async (input) => {
              const step = await createStep.mutateAsync({
                buildId: build.id,
                jobId: addingStepTo.id,
                input,
              });
              setAddingStepTo(null);
              setNotice(`Added the step “${step.title}”.`);
            }}
          />
        )}
      </Modal>
    </>
  );
}
