import { useNavigate, useParams } from 'react-router-dom';
import { can } from '@shared/permissions';
import { paths } from '@/config/paths';
import { useBuild } from '@/features/builds/api/get-build';
import { useUpdateBuild } from '@/features/builds/api/update-build';
import { BuildForm, buildToFormValues } from '@/features/builds/components/build-form';
import { PageHeader } from '@/app/layouts/page-header';
import { Alert } from '@/components/ui/alert';
import { ButtonLink } from '@/components/ui/button';
import { PageSpinner } from '@/components/ui/spinner';
import { BuildLoadError } from './build-states';

/** "/builds/:buildId/edit" — owners only; other roles are told so instead of shown a form. */
export function EditBuildRoute() {
  const { buildId = '' } = useParams();
  const navigate = useNavigate();
  const build = useBuild(buildId);
  const updateBuild = useUpdateBuild();

  if (build.isPending) return <PageSpinner label="Loading the build…" />;
  if (build.isError) {
    return <BuildLoadError error={build.error} onRetry={() => void build.refetch()} />;
  }
  const b = build.data;
  const overview = paths.builds.overview.getHref(b.id);

  return (
    <>
      <title>{`Edit ${b.name} · Headroom`}</title>
      <PageHeader
        back={{ to: overview, label: b.name }}
        title="Edit build"
        subtitle={<span className="text-base text-muted">{b.name}</span>}
      />
      {can(b.myRole, 'build:update') ? (
        <BuildForm
          // Remount when another build is opened so the defaults are that build's.
          key={b.id}
          defaultValues={buildToFormValues(b)}
          submitLabel="Save changes"
          cancelHref={overview}
          onSubmit={async (values) => {
            await updateBuild.mutateAsync({ buildId: b.id, input: values });
            navigate(overview);
          }}
        />
      ) : (
        <div className="flex flex-col items-start gap-4">
          <Alert tone="info" title="Only an owner can edit this build">
            Ask an owner if something here needs changing.
          </Alert>
          <ButtonLink to={overview} variant="secondary">
            Back to the build
          </ButtonLink>
        </div>
      )}
    </>
  );
}
