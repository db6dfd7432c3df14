import { useNavigate } from 'react-router-dom';
import { paths } from '@/config/paths';
import { useCreateBuild } from '@/features/builds/api/create-build';
import { BuildForm, newBuildDefaults } from '@/features/builds/components/build-form';
import { PageHeader } from '@/app/layouts/page-header';
import { deviceTimeZone } from '@shared/dates';

/** "/builds/new" — whoever starts a build owns it. */
export function NewBuildRoute() {
  const navigate = useNavigate();
  const createBuild = useCreateBuild();
  return (
    <>
      <title>Start a build · Headroom</title>
      <PageHeader
        title="Start a build"
        subtitle={
          <span className="text-base text-muted">
            You will be its owner. Everything can be changed later.
          </span>
        }
        back={{ to: paths.builds.list.getHref(), label: 'My builds' }}
      />
      <BuildForm
        defaultValues={newBuildDefaults}
        submitLabel="Create build"
        cancelHref={paths.builds.list.getHref()}
        onSubmit={async (values) => {
          // The build counts its days in the owner's own time zone until they choose another.
          const build = await createBuild.mutateAsync({ ...values, timeZone: deviceTimeZone() });
          navigate(paths.builds.overview.getHref(build.id));
        }}
      />
    </>
  );
}
