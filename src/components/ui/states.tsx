import type { ReactNode } from 'react';
import { RefreshCw, SearchX, TriangleAlert } from 'lucide-react';
import { isApiError } from '@/lib/api-client';
import { Button } from './button';

type TitleTag = 'p' | 'h1' | 'h2';

function StateBox({
  icon,
  title,
  titleAs: Title = 'p',
  children,
  actions,
  role,
}: {
  icon: ReactNode;
  title: string;
  titleAs?: TitleTag;
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
      <Title className="text-lg font-bold text-ink">{title}</Title>
      {children && <div className="text-muted">{children}</div>}
      {actions && <div className="mt-1 flex flex-wrap justify-center gap-2">{actions}</div>}
    </div>
  );
}

export function EmptyState({
  icon,
  title,
  titleAs,
  children,
  actions,
}: {
  icon: ReactNode;
  title: string;
  titleAs?: TitleTag;
  children?: ReactNode;
  actions?: ReactNode;
}) {
  return (
    <StateBox icon={icon} title={title} titleAs={titleAs} actions={actions}>
      {children}
    </StateBox>
  );
}

/** What went wrong, in words a user can act on; a retry where retrying can help. */
export function ErrorState({
  title = 'Could not load this',
  titleAs,
  error,
  onRetry,
  actions,
}: {
  title?: string;
  titleAs?: TitleTag;
  error: unknown;
  onRetry?: () => void;
  actions?: ReactNode;
}) {
  const message = isApiError(error)
    ? error.message
    : 'Something unexpected happened. Try again in a moment.';
  const retryable =
    !isApiError(error) || error.status === 0 || error.status >= 500 || error.status === 429;
  return (
    <StateBox
      role="alert"
      icon={<TriangleAlert aria-hidden className="size-6 text-over" />}
      title={title}
      titleAs={titleAs}
      actions={
        <>
          {onRetry && retryable && (
            <Button
              variant="secondary"
              onClick={onRetry}
              icon={<RefreshCw aria-hidden className="size-4" />}
            >
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
  titleAs,
  children,
  actions,
}: {
  title?: string;
  titleAs?: TitleTag;
  children?: ReactNode;
  actions?: ReactNode;
}) {
  return (
    <StateBox
      icon={<SearchX aria-hidden className="size-6" />}
      title={title}
      titleAs={titleAs}
      actions={actions}
    >
      {children}
    </StateBox>
  );
}
