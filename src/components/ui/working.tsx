import type { ReactNode } from 'react';
import { ChevronRight } from 'lucide-react';
import { cn } from './cn';

/**
 * "Show the working": the one way a figure opens to show its arithmetic (estimate, bench and
 * dyno). A feature turns its figure into a `WorkingFigureProps` (its own units and words) and
 * puts one or more `WorkingFigure`s inside a `ShowWorking`.
 */

/** "Show the working" on a native <details>: opens by keyboard, needs no state. */
export function ShowWorking({
  children,
  summary = 'Show the working',
  label,
  className,
}: {
  children: ReactNode;
  summary?: ReactNode;
  /** Read after the summary by screen readers, to tell the many "Show the working" apart. */
  label?: string;
  className?: string;
}) {
  return (
    <details className={cn('group text-[15px]', className)}>
      <summary className="inline-flex min-h-11 cursor-pointer list-none items-center gap-1 rounded font-semibold text-accent-700 hover:underline [&::-webkit-details-marker]:hidden">
        <ChevronRight aria-hidden className="size-4 transition-transform group-open:rotate-90" />
        {summary}
        {label && <span className="sr-only">: {label}</span>}
      </summary>
      <div className="mt-1 flex flex-col gap-3 divide-y divide-rule rounded-md border border-rule bg-paper/60 px-3 py-3 [&>*+*]:pt-3">
        {children}
      </div>
    </details>
  );
}

export type WorkingFigureProps = {
  title: string;
  formula: string;
  /** The result as text with its unit, rounded as on the rest of the page. */
  value?: string;
  /** Each input with its value (as text) and where it came from, in words. */
  inputs?: { name: string; value: string; from: string }[];
  /** The steps in order; `numbered` draws them as a numbered list. */
  steps?: ReactNode[];
  numbered?: boolean;
  /** Each constant with its value (as text) and its source. */
  constants?: { name: string; value: string; source: string }[];
  /** The rule the figure was judged by. */
  rule?: { heading: string; wording: string; source: string };
};

const heading = 'text-xs font-semibold tracking-wide text-muted uppercase';

/** One figure's arithmetic: the formula, every input and where it came from, steps, constants and sources. */
export function WorkingFigure({
  title,
  formula,
  value,
  inputs = [],
  steps = [],
  numbered = false,
  constants = [],
  rule,
}: WorkingFigureProps) {
  return (
    <div className="flex flex-col gap-2">
      <div>
        <p className="font-semibold text-ink">{title}</p>
        <p className="font-mono text-sm break-words text-ink-2">{formula}</p>
        {value && <p className="font-semibold tabular-nums text-ink">= {value}</p>}
      </div>
      {inputs.length > 0 && (
        <div>
          <p className={heading}>Inputs</p>
          <ul className="flex flex-col gap-0.5">
            {inputs.map((input, i) => (
              <li key={`${input.name}-${i}`} className="flex flex-wrap gap-x-2">
                <span className="text-ink-2">{input.name}</span>
                <span className="font-semibold tabular-nums">{input.value}</span>
                <span className="text-sm text-muted">({input.from})</span>
              </li>
            ))}
          </ul>
        </div>
      )}
      {steps.length > 0 && (
        <div>
          <p className={heading}>Steps</p>
          <ol
            className={cn(
              'flex flex-col',
              numbered ? 'list-decimal gap-0.5 pl-5 tabular-nums' : 'gap-1',
            )}
          >
            {steps.map((step, i) => (
              <li key={i} className={cn(numbered && 'break-words text-ink-2')}>
                {step}
              </li>
            ))}
          </ol>
        </div>
      )}
      {constants.length > 0 && (
        <div>
          <p className={heading}>Constants</p>
          <ul className="flex flex-col gap-1">
            {constants.map((c, i) => (
              <li key={`${c.name}-${i}`}>
                <span className="text-ink-2">{c.name}</span>{' '}
                <span className="font-semibold tabular-nums">{c.value}</span>
                <span className="block text-sm text-muted">Source: {c.source}</span>
              </li>
            ))}
          </ul>
        </div>
      )}
      {rule && (
        <div>
          <p className={heading}>{rule.heading}</p>
          <p className="text-ink-2">{rule.wording}</p>
          <p className="text-sm text-muted">Source: {rule.source}</p>
        </div>
      )}
    </div>
  );
}
