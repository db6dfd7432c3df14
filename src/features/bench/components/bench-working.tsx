import type { BenchFigure, BenchWorkingInput } from '@shared/schemas/bench';
import { benchUnitLabels, type BenchUnit } from '@shared/bench';
import { formatNumber } from '@shared/format';
import { ShowWorking, WorkingFigure } from '@/components/ui/working';

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

/** "Show the working" for bench figures: each with its inputs, steps and the rule it was judged by. */
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
    <ShowWorking label={label} className={className}>
      {figures.map((figure, i) => {
        const { formula, inputs, steps, rule } = figure.working;
        return (
          <WorkingFigure
            key={`${figure.label}-${i}`}
            title={figure.label}
            formula={formula}
            value={figureText(figure.value, figure.unit)}
            inputs={inputs.map((input) => ({
              name: input.name,
              value: figureText(input.value, input.unit),
              from: fromLabels[input.from],
            }))}
            steps={steps.map((step) => step.text)}
            numbered
            rule={{ heading: `Rule (${rule.status})`, wording: rule.wording, source: rule.source }}
          />
        );
      })}
    </ShowWorking>
  );
}
