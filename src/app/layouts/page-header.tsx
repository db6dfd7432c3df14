import type { ReactNode } from 'react';
import { Link } from 'react-router-dom';
import { ChevronLeft } from 'lucide-react';

/** The top of a page: an optional way back, the page's one h1, a line under it, actions. */
export function PageHeader({
  title,
  subtitle,
  actions,
  back,
  badges,
}: {
  title: ReactNode;
  subtitle?: ReactNode;
  actions?: ReactNode;
  back?: { to: string; label: string };
  badges?: ReactNode;
}) {
  return (
    <div className="mb-6">
      {back && (
        <Link
          to={back.to}
          className="-ml-1 mb-2 inline-flex min-h-11 items-center gap-1 rounded px-1 font-semibold text-accent-700 hover:underline"
        >
          <ChevronLeft aria-hidden className="size-4" />
          {back.label}
        </Link>
      )}
      <div className="flex flex-col gap-3 sm:flex-row sm:items-start sm:justify-between">
        <div className="min-w-0">
          <h1 className="text-3xl leading-tight font-bold tracking-tight break-words text-ink sm:text-[2.1rem]">
            {title}
          </h1>
          {(subtitle || badges) && (
            <div className="mt-1.5 flex flex-wrap items-center gap-x-3 gap-y-1.5 text-lg text-ink-2">
              {subtitle}
              {badges}
            </div>
          )}
        </div>
        {actions && <div className="flex shrink-0 flex-wrap gap-2">{actions}</div>}
      </div>
    </div>
  );
}
