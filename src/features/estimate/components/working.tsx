import type { ReactNode } from 'react';
import type { Figure, WorkingInput } from '@shared/schemas/estimate';
import { ShowWorking, WorkingFigure } from '@/components/ui/working';
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

/**
 * "Show the working" for one or more figures: the formula, every input and where it came
 * from, each constant's source. Rounded as on the rest of the page; the API keeps every digit.
 */
export function Working({
  figures,
  summary,
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
    <ShowWorking summary={summary} label={label} className={className}>
      {figures.map((figure, i) => (
        <WorkingFigure
          key={`${figure.label}-${i}`}
          title={figure.label}
          formula={figure.working.formula}
          value={formatFigure(figure.value, figure.unit)}
          inputs={figure.working.inputs.map((input) => ({
            name: input.name,
            value: formatFigure(input.value, input.unit),
            from: workingSourceLabels[input.from],
          }))}
          constants={figure.working.constants.map((c) => ({
            name: c.name,
            value: constantText(c.value, c.unit),
            source: c.source,
          }))}
        />
      ))}
    </ShowWorking>
  );
}
