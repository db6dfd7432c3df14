import { isRouteErrorResponse, useRouteError } from 'react-router-dom';
import { ErrorState } from '@/components/ui/states';
import { Button } from '@/components/ui/button';

/**
 * A page that crashed while rendering, or a lazy chunk that failed to load (often after a
 * deploy replaced it): offer a reload rather than a blank screen.
 */
export function RouteErrorPage() {
  const error = useRouteError();
  const title = isRouteErrorResponse(error)
    ? `${error.status} ${error.statusText}`
    : 'This page hit a problem';
  return (
    <div className="mx-auto max-w-5xl px-4 py-10">
      <ErrorState
        title={title}
        titleAs="h1"
        error={error}
        actions={<Button onClick={() => window.location.reload()}>Reload the page</Button>}
      />
    </div>
  );
}
