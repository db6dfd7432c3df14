import type { ReactNode } from 'react';
import { cn } from './cn';

export function Card({ children, className }: { children: ReactNode; className?: string }) {
  return (
    <div
      className={cn(
        'rounded-lg border border-rule bg-sheet shadow-[0_1px_0_rgba(27,34,48,0.04)]',
        className,
      )}
    >
      {children}
    </div>
  );
}

/** A titled section of a page (an h2 with an optional icon and actions on the right). */
export function Section({
  title,
  icon,
  actions,
  children,
  className,
  id,
}: {
  title: string;
  icon?: ReactNode;
  actions?: ReactNode;
  children: ReactNode;
  className?: string;
  id?: string;
}) {
  const headingId = id ? `${id}-title` : undefined;
  return (
    <section
      aria-labelledby={headingId}
      id={id}
      className={cn('rounded-lg border border-rule bg-sheet', className)}
    >
      <div className="flex flex-wrap items-center justify-between gap-2 border-b border-rule px-4 py-2.5 sm:px-5">
        <h2 id={headingId} className="flex items-center gap-2 text-lg font-bold text-ink">
          {icon}
          {title}
        </h2>
        {actions}
      </div>
      <div className="px-4 py-4 sm:px-5">{children}</div>
    </section>
  );
}
