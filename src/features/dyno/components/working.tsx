import type { ReactNode } from 'react';
import { ChevronRight } from 'lucide-react';
import type { DynoFigure, DynoWorking, DynoWorkingInput } from '../../../../shared/schemas/dyno';
import { formatNumber } from '../../../../shared/format';
import { cn } from '../../../components/ui/cn';
import { valueText } from '../format';

const fromLabels: Record<DynoWorkingInput['from'], string> = {
  weather: 'the weather recorded',
  run: 'the run',
  build: 'the build',
  assumption: 'the estimate’s assumptions',
  choice: 'your choice',
  figure: 'worked out',
};

/** The arithmetic of one figure: formula, inputs and where each came from, constants and their sources, each step. */
export function WorkingBody({
  title,
  value,
  working,
}: {
  title: string;
  value?: string;
  working: DynoWorking;
}) {
  const { formula, inputs, constants, steps } = working;
  return (
    <div className="flex flex-col gap-2">
      <div>
        <p className="font-semibold text-ink">{title}</p>
        <p className="font-mono text-sm break-words text-ink-2">{formula}</p>
        {value && <p className="font-semibold tabular-nums text-ink">= {value}</p>}
      </div>
      {inputs.length > 0 && (
        <div>
          <p className="text-xs font-semibold tracking-wide text-muted uppercase">Inputs</p>
          <ul className="flex flex-col gap-0.5">
            {inputs.map((input, i) => (
              <li key={`${input.name}-${i}`} className="flex flex-wrap gap-x-2">
                <span className="text-ink-2">{input.name}</span>
                <span className="font-semibold tabular-nums">
                  {valueText(input.value, input.unit, 6)}
                </span>
                <span className="text-sm text-muted">({fromLabels[input.from]})</span>
              </li>
            ))}
          </ul>
        </div>
      )}
      {steps.length > 0 && (
        <div>
          <p className="text-xs font-semibold tracking-wide text-muted uppercase">Steps</p>
          <ol className="flex flex-col gap-1">
            {steps.map((s, i) => (
              <li key={`${s.label}-${i}`}>
                <span className="text-ink-2">{s.label}:</span>{' '}
                <span className="font-mono text-sm break-words text-ink">{s.expression}</span>
              </li>
            ))}
          </ol>
        </div>
      )}
      {constants.length > 0 && (
        <div>
          <p className="text-xs font-semibold tracking-wide text-muted uppercase">Constants</p>
          <ul className="flex flex-col gap-1">
            {constants.map((c, i) => (
              <li key={`${c.name}-${i}`}>
                <span className="text-ink-2">{c.name}</span>{' '}
                <span className="font-semibold tabular-nums">{valueText(c.value, c.unit, 8)}</span>
                <span className="block text-sm text-muted">Source: {c.source}</span>
              </li>
            ))}
          </ul>
        </div>
      )}
    </div>
  );
}

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

/** The working of a few figures at once. */
export function FiguresWorking({ figures, label }: { figures: DynoFigure[]; label?: string }) {
  return (
    <ShowWorking label={label}>
      {figures.map((f, i) => (
        <WorkingBody
          key={`${f.label}-${i}`}
          title={f.label}
          value={valueText(f.value, f.unit, 4)}
          working={f.working}
        />
      ))}
    </ShowWorking>
  );
}

export const pct = (value: number) => `${formatNumber(value, 1)} %`;
