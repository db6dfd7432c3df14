import { Plus, Truck } from 'lucide-react';
import { paths } from '@/config/paths';
import { useBuilds } from '@/features/builds/api/get-builds';
import { BuildCard, BuildCardSkeleton } from '@/features/builds/components/build-card';
import { PageHeader } from '@/app/layouts/page-header';
import { ButtonLink } from '@/components/ui/button';
import { EmptyState, ErrorState } from '@/components/ui/states';

function StartBuildLink() {
  return (
    <ButtonLink to={paths.builds.new.getHref()} icon={<Plus aria-hidden className="size-5" />}>
      Start a build
    </ButtonLink>
  );
}

/** "/builds" — every build I am on, whatever my role. */
export function BuildsListRoute() {
  const builds = useBuilds();
  const count = builds.data?.length ?? 0;

  let body;
  if (builds.isPending) {
    body = (
      <div role="status" aria-label="Loading your builds" className="grid gap-4 sm:grid-cols-2">
        <BuildCardSkeleton />
        <BuildCardSkeleton />
      </div>
    );
  } else if (builds.isError) {
    body = (
      <ErrorState
        title="Could not load your builds"
        error={builds.error}
        onRetry={() => void builds.refetch()}
      />
    );
  } else if (count === 0) {
    body = (
      <EmptyState
        icon={<Truck aria-hidden className="size-6" />}
        title="No builds yet"
        actions={<StartBuildLink />}
      >
        Start one for your truck: the target, the date, the budget. Builds others add you to show up
        here too.
      </EmptyState>
    );
  } else {
    body = (
      <ul className="grid gap-4 sm:grid-cols-2">
        {builds.data.map((build) => (
          <li key={build.id}>
            <BuildCard build={build} />
          </li>
        ))}
      </ul>
    );
  }

  return (
    <>
      <title>My builds · Headroom</title>
      <PageHeader
        title="My builds"
        subtitle={
          count > 0 ? (
            <span className="text-base text-muted">
              {count} {count === 1 ? 'build' : 'builds'}
            </span>
          ) : undefined
        }
        actions={count > 0 ? <StartBuildLink /> : undefined}
      />
      {body}
    </>
  );
}
