import type { ReactNode } from 'react';
import { ChevronRight } from 'lucide-react';
import type { Figure, WorkingInput } from '../../../../shared/schemas/estimate';
import { cn } from '../../../components/ui/cn';
import { formatFigure } from '../format';

/** Where an input comes from, in words. */
export const workingSourceLabels: Record<WorkingInput['from'], string> = {
  target: 'the build’s target',
  build: 'the build’s engine',
  assumption: 'assumption',
  part: 'the part’s rating',
  figure: 'worked out',
};

/**
 * A constant to the digits that say which constant it is (10 significant: exact ones such as
 * 3.785411784 L/gal show whole), not the 16 of a double.
 */
function constantText(value: number, unit: string): string {
  const n = new Intl.NumberFormat(undefined, { maximumSignificantDigits: 10 }).format(value);
  return unit === 'ratio' ? `${n}:1` : `${n} ${unit}`;
}

/** One figure's arithmetic: the formula, every input and where it came from, each constant's source. */
function FigureWorking({ figure }: { figure: Figure }) {
  const { formula, inputs, constants } = figure.working;
  return (
    <div className="flex flex-col gap-2">
      <div>
        <p className="font-semibold text-ink">{figure.label}</p>
        <p className="font-mono text-sm break-words text-ink-2">{formula}</p>
        {/* Rounded as on the rest of the page; the API keeps every digit. */}
        <p className="font-semibold tabular-nums text-ink">
          = {formatFigure(figure.value, figure.unit)}
        </p>
      </div>
      {inputs.length > 0 && (
        <div>
          <p className="text-xs font-semibold tracking-wide text-muted uppercase">Inputs</p>
          <ul className="flex flex-col gap-0.5">
            {inputs.map((input, i) => (
              <li key={`${input.name}-${i}`} className="flex flex-wrap gap-x-2">
                <span className="text-ink-2">{input.name}</span>
                <span className="font-semibold tabular-nums">
                  {formatFigure(input.value, input.unit)}
                </span>
                <span className="text-sm text-muted">({workingSourceLabels[input.from]})</span>
              </li>
            ))}
          </ul>
        </div>
      )}
      {constants.length > 0 && (
        <div>
          <p className="text-xs font-semibold tracking-wide text-muted uppercase">Constants</p>
          <ul className="flex flex-col gap-1">
            {constants.map((c) => (
              <li key={c.name}>
                <span className="text-ink-2">{c.name}</span>{' '}
                <span className="font-semibold tabular-nums">{constantText(c.value, c.unit)}</span>
                <span className="block text-sm text-muted">Source: {c.source}</span>
              </li>
            ))}
          </ul>
        </div>
      )}
    </div>
  );
}

/**
 * "Show the working" for one or more figures, on a native <details> so it opens by keyboard
 * and needs no state.
 */
export function Working({
  figures,
  summary = 'Show the working',
  label,
  className,
}: {
  figures: Figure[];
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
        {figures.map((f, i) => (
          <FigureWorking key={`${f.label}-${i}`} figure={f} />
        ))}
      </div>
    </details>
  );
}
