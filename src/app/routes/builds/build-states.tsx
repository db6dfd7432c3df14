import { paths } from '@/config/paths';
import { isApiError } from '@/lib/api-client';
import { ButtonLink } from '@/components/ui/button';
import { ErrorState, NotFoundState } from '@/components/ui/states';

/**
 * A build that could not be loaded. 404 covers "no such build" and "not on its crew" alike:
 * the API does not say which, and neither does this page.
 */
export function BuildLoadError({ error, onRetry }: { error: unknown; onRetry: () => void }) {
  const back = (
    <ButtonLink to={paths.builds.list.getHref()} variant="secondary">
      Back to My builds
    </ButtonLink>
  );
  if (isApiError(error) && error.status === 404) {
    return (
      <>
        <title>Build not found · Headroom</title>
        <NotFoundState title="Build not found" titleAs="h1" actions={back}>
          It may have been deleted, or you are not on its crew.
        </NotFoundState>
      </>
    );
  }
  return (
    <ErrorState
      title="Could not load this build"
      titleAs="h1"
      error={error}
      onRetry={onRetry}
      actions={back}
    />
  );
}
