import type { ReactNode } from 'react';
import { CircleAlert, CircleCheck, Info, TriangleAlert } from 'lucide-react';
import { cn } from './cn';

type Tone = 'error' | 'warning' | 'info' | 'ok';

const tones: Record<Tone, { box: string; icon: ReactNode }> = {
  error: {
    box: 'border-over/40 bg-over-soft text-[#7d1f17]',
    icon: <CircleAlert aria-hidden className="mt-0.5 size-5 shrink-0 text-over" />,
  },
  warning: {
    box: 'border-tight/40 bg-tight-soft text-[#6b4408]',
    icon: <TriangleAlert aria-hidden className="mt-0.5 size-5 shrink-0 text-tight" />,
  },
  info: {
    box: 'border-rule-strong bg-sheet text-ink-2',
    icon: <Info aria-hidden className="mt-0.5 size-5 shrink-0 text-ink-3" />,
  },
  ok: {
    box: 'border-ok/40 bg-ok-soft text-[#1d5434]',
    icon: <CircleCheck aria-hidden className="mt-0.5 size-5 shrink-0 text-ok" />,
  },
};

/** A boxed message. Errors are announced immediately (role="alert"), the rest politely. */
export function Alert({
  tone = 'info',
  title,
  children,
  className,
}: {
  tone?: Tone;
  title?: ReactNode;
  children?: ReactNode;
  className?: string;
}) {
  return (
    <div
      role={tone === 'error' ? 'alert' : 'status'}
      className={cn(
        'flex gap-2.5 rounded-md border px-3.5 py-3 text-[15px]',
        tones[tone].box,
        className,
      )}
    >
      {tones[tone].icon}
      <div className="min-w-0">
        {title && <p className="font-semibold">{title}</p>}
        {children && <div className={title ? 'mt-0.5' : undefined}>{children}</div>}
      </div>
    </div>
  );
}
