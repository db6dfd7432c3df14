import type { ReactNode } from 'react';
import { RefreshCw, SearchX, TriangleAlert } from 'lucide-react';
import { isApiError } from '../../lib/api-client';
import { Button } from './button';

function StateBox({
  icon,
  title,
  children,
  actions,
  role,
}: {
  icon: ReactNode;
  title: string;
  children?: ReactNode;
  actions?: ReactNode;
  role?: 'alert' | 'status';
}) {
  return (
    <div
      role={role}
      className="mx-auto flex max-w-md flex-col items-center gap-3 rounded-lg border border-dashed border-rule-strong bg-sheet/70 px-5 py-10 text-center"
    >
      <div className="flex size-12 items-center justify-center rounded-full bg-ink/[0.06] text-ink-3">
        {icon}
      </div>
      <p className="text-lg font-bold text-ink">{title}</p>
      {children && <div className="text-muted">{children}</div>}
      {actions && <div className="mt-1 flex flex-wrap justify-center gap-2">{actions}</div>}
    </div>
  );
}

export function EmptyState({
  icon,
  title,
  children,
  actions,
}: {
  icon: ReactNode;
  title: string;
  children?: ReactNode;
  actions?: ReactNode;
}) {
  return (
    <StateBox icon={icon} title={title} actions={actions}>
      {children}
    </StateBox>
  );
}

/** What went wrong, in words a user can act on; a retry where retrying can help. */
export function ErrorState({
  title = 'Could not load this',
  error,
  onRetry,
  actions,
}: {
  title?: string;
  error: unknown;
  onRetry?: () => void;
  actions?: ReactNode;
}) {
  const message = isApiError(error)
    ? error.message
    : 'Something unexpected happened. Try again in a moment.';
  const retryable = !isApiError(error) || error.status === 0 || error.status >= 500 || error.status === 429;
  return (
    <StateBox
      role="alert"
      icon={<TriangleAlert aria-hidden className="size-6 text-over" />}
      title={title}
      actions={
        <>
          {onRetry && retryable && (
            <Button variant="secondary" onClick={onRetry} icon={<RefreshCw aria-hidden className="size-4" />}>
              Try again
            </Button>
          )}
          {actions}
        </>
      }
    >
      <p>{message}</p>
    </StateBox>
  );
}

export function NotFoundState({
  title = 'Not found',
  children,
  actions,
}: {
  title?: string;
  children?: ReactNode;
  actions?: ReactNode;
}) {
  return (
    <StateBox icon={<SearchX aria-hidden className="size-6" />} title={title} actions={actions}>
      {children}
    </StateBox>
  );
}
