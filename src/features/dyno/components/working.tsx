import type { DynoFigure, DynoWorking, DynoWorkingInput } from '@shared/schemas/dyno';
import { formatNumber } from '@shared/format';
import { ShowWorking, WorkingFigure } from '@/components/ui/working';
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
    <WorkingFigure
      title={title}
      formula={formula}
      value={value}
      inputs={inputs.map((input) => ({
        name: input.name,
        value: valueText(input.value, input.unit, 6),
        from: fromLabels[input.from],
      }))}
      steps={steps.map((s) => (
        <>
          <span className="text-ink-2">{s.label}:</span>{' '}
          <span className="font-mono text-sm break-words text-ink">{s.expression}</span>
        </>
      ))}
      constants={constants.map((c) => ({
        name: c.name,
        value: valueText(c.value, c.unit, 8),
        source: c.source,
      }))}
    />
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
