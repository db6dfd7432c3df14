import { CloudSun } from 'lucide-react';
import type { ComponentProps } from 'react';
import { Section } from '@/components/ui/card';
import { weatherText } from '../format';
import { CorrectionFigure, StandardPicker } from './correction-panel';

type PickerProps = ComponentProps<typeof StandardPicker>;

/** The session's weather, the standard picker and the correction factor it gives. */
export function SessionCorrection({
  weather,
  choice,
  onChoice,
  buildAspiration,
  correction,
  correctionTitle,
}: {
  weather: Parameters<typeof weatherText>[0] | null;
  choice: PickerProps['choice'];
  onChoice: PickerProps['onChange'];
  buildAspiration: PickerProps['buildAspiration'];
  correction: ComponentProps<typeof CorrectionFigure>['correction'];
  correctionTitle: string;
}) {
  return (
    <Section
      id="correction"
      title="Weather and correction"
      icon={<CloudSun aria-hidden className="size-5 text-ink-3" />}
    >
      <div className="flex flex-col gap-4">
        <p className="text-ink-2" data-testid="session-weather">
          {weather ? (
            <>
              <strong className="text-ink">At the session:</strong> {weatherText(weather)}
            </>
          ) : (
            'No weather recorded for the session: runs without their own stay as measured.'
          )}
        </p>
        <StandardPicker
          key={choice.standard}
          choice={choice}
          onChange={onChoice}
          buildAspiration={buildAspiration}
        />
        <CorrectionFigure correction={correction} title={correctionTitle} />
      </div>
    </Section>
  );
}
