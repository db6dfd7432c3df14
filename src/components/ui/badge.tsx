import type { ReactNode } from 'react';
import { cn } from './cn';

type Tone = 'neutral' | 'info' | 'accent' | 'ink' | 'ok' | 'tight' | 'over';

const tones: Record<Tone, string> = {
  neutral: 'bg-ink/[0.06] text-ink-2',
  // Neutral states that still want to stand out (work under way): never a warning colour.
  info: 'bg-state-blue-soft text-state-blue',
  accent: 'bg-accent-50 text-accent-700 ring-1 ring-accent-100',
  ink: 'bg-ink text-white',
  ok: 'bg-ok-soft text-[#1d5434]',
  tight: 'bg-tight-soft text-[#6b4408]',
  over: 'bg-over-soft text-[#7d1f17]',
};

export function Badge({
  tone = 'neutral',
  children,
  className,
}: {
  tone?: Tone;
  children: ReactNode;
  className?: string;
}) {
  return (
    <span
      className={cn(
        'inline-flex items-center gap-1 rounded px-2 py-0.5 text-sm font-semibold whitespace-nowrap',
        tones[tone],
        className,
      )}
    >
      {children}
    </span>
  );
}
