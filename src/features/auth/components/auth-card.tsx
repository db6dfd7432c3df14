import type { ReactNode } from 'react';
import { HeadroomMark } from '@/components/ui/logo';
import { cn } from '@/components/ui/cn';

/**
 * The card of the pages reached from a mail or from sign-in (invitation, forgotten and new
 * password): the sign-in page's look, without its redirect of signed-in visitors.
 */
export function AuthCard({
  title,
  lead,
  wide = false,
  children,
}: {
  title: ReactNode;
  lead?: ReactNode;
  wide?: boolean;
  children: ReactNode;
}) {
  return (
    <div className={cn('mx-auto w-full', wide ? 'max-w-lg' : 'max-w-md')}>
      <div className="rounded-lg border border-rule bg-sheet p-5 shadow-sm sm:p-7">
        <div className="mb-5 flex items-center gap-3">
          <HeadroomMark className="size-10 shrink-0" />
          <div className="min-w-0">
            <h1 className="text-2xl leading-tight font-bold break-words">{title}</h1>
            {lead && <p className="text-ink-2">{lead}</p>}
          </div>
        </div>
        {children}
      </div>
    </div>
  );
}
