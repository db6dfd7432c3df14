import { useParams } from 'react-router-dom';
import { Printer } from 'lucide-react';
import { paths } from '@/config/paths';
import { isApiError } from '@/lib/api-client';
import { ButtonLink } from '@/components/ui/button';
import { PageSpinner } from '@/components/ui/spinner';
import { ErrorState } from '@/components/ui/states';
import { NotShared } from '@/features/sharing/components/not-shared';
import { useSharedBuild } from '@/features/sharing/api/get-shared-build';
import { PublicBuild } from '@/features/sharing/components/public-build';

/** "/shared/:token" — a build's public page: read-only, no sign-in, what its owner chose. */
export function SharedBuildRoute() {
  const { token = '' } = useParams();
  const shared = useSharedBuild(token);

  if (shared.isPending) return <PageSpinner label="Loading the build…" />;
  if (shared.isError) {
    if (isApiError(shared.error) && shared.error.status === 404) {
      return <NotShared />;
    }
    return (
      <ErrorState
        title="Could not load this build"
        titleAs="h1"
        error={shared.error}
        onRetry={() => void shared.refetch()}
      />
    );
  }
  return (
    <>
      <title>{`${shared.data.name} · Headroom`}</title>
      <PublicBuild
        view={shared.data}
        actions={
          <ButtonLink
            to={paths.shared.sheet.getHref(token)}
            variant="secondary"
            icon={<Printer aria-hidden className="size-4" />}
          >
            Build sheet
          </ButtonLink>
        }
      />
    </>
  );
}
