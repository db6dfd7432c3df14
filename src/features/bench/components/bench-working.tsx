import { ChevronRight } from 'lucide-react';
import type { BenchFigure, BenchWorkingInput } from '../../../../shared/schemas/bench';
import { benchUnitLabels, type BenchUnit } from '../../../../shared/bench';
import { formatNumber } from '../../../../shared/format';
import { cn } from '../../../components/ui/cn';

const fromLabels: Record<BenchWorkingInput['from'], string> = {
  sheet: 'from the sheet',
  build: 'the build’s target',
  figure: 'worked out',
};

function unitWords(unit: string): string {
  if (unit === '%') return '%';
  if (unit === 'hp-crank') return 'crank hp';
  if (unit === 'hp-wheel') return 'wheel hp';
  return benchUnitLabels[unit as BenchUnit] ?? unit;
}

/** A figure with its unit, to four significant decimals: the working shows more than the summary. */
export function figureText(value: number, unit: string, digits = 4): string {
  return `${formatNumber(value, digits)} ${unitWords(unit)}`;
}

function FigureWorking({ figure }: { figure: BenchFigure }) {
  const { formula, inputs, steps, rule } = figure.working;
  return (
    <div className="flex flex-col gap-2">
      <div>
        <p className="font-semibold text-ink">{figure.label}</p>
        <p className="font-mono text-sm break-words text-ink-2">{formula}</p>
        <p className="font-semibold tabular-nums text-ink">
          = {figureText(figure.value, figure.unit)}
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
                  {figureText(input.value, input.unit)}
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
          <ol className="flex list-decimal flex-col gap-0.5 pl-5 tabular-nums">
            {steps.map((step, i) => (
              <li key={i} className="break-words text-ink-2">
                {step.text}
              </li>
            ))}
          </ol>
        </div>
      )}
      <div>
        <p className="text-xs font-semibold tracking-wide text-muted uppercase">
          Rule ({rule.status})
        </p>
        <p className="text-ink-2">{rule.wording}</p>
        <p className="text-sm text-muted">Source: {rule.source}</p>
      </div>
    </div>
  );
}

/** "Show the working" for bench figures, on a native <details> so it opens by keyboard. */
export function BenchWorking({
  figures,
  label,
  className,
}: {
  figures: BenchFigure[];
  /** Read after the summary by screen readers, to tell several apart. */
  label?: string;
  className?: string;
}) {
  return (
    <details className={cn('group text-[15px]', className)}>
      <summary className="inline-flex min-h-11 cursor-pointer list-none items-center gap-1 rounded font-semibold text-accent-700 hover:underline [&::-webkit-details-marker]:hidden">
        <ChevronRight aria-hidden className="size-4 transition-transform group-open:rotate-90" />
        Show the working
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
