import { useState } from 'react';
import {
  correctionStandardLabels,
  correctionStandards,
  engineAspirationLabels,
  engineAspirations,
  engineFactorLimits,
  type CorrectionChoice,
  type CorrectionResult,
  type CorrectionStandard,
  type EngineAspiration,
} from '@shared/schemas/dyno';
import { standardShortLabels } from '@shared/dyno/vocabulary';
import { formatNumber } from '@shared/format';
import { parseNumber } from '@shared/numbers';
import { Alert } from '@/components/ui/alert';
import { Badge } from '@/components/ui/badge';
import { FormField, SelectInput } from '@/components/ui/form-field';
import { NumberInput } from '@/components/ui/number-input';
import { factorText } from '../format';
import { ShowWorking } from '@/components/ui/working';
import { WorkingBody } from './working';

/**
 * The standard the figures are shown in. For R85, the engine's aspiration and the engine
 * factor f_m to use when a run does not give what q_c needs.
 */
export function StandardPicker({
  choice,
  onChange,
  buildAspiration,
}: {
  choice: CorrectionChoice;
  onChange: (next: CorrectionChoice) => void;
  /** The build's aspiration as R85 groups it, used when none is chosen. */
  buildAspiration?: EngineAspiration;
}) {
  const [fmText, setFmText] = useState(
    choice.engineFactor != null ? String(choice.engineFactor) : '',
  );
  const fm = parseNumber(fmText);
  const fmInvalid = fm !== null && !(fm >= engineFactorLimits.min && fm <= engineFactorLimits.max);
  return (
    <div className="flex flex-col gap-3">
      <FormField
        label="Correction standard"
        hint={correctionStandardLabels[choice.standard]}
        className="max-w-md"
      >
        {(c) => (
          <SelectInput
            {...c}
            value={choice.standard}
            onChange={(e) =>
              onChange({ ...choice, standard: e.target.value as CorrectionStandard })
            }
          >
            {correctionStandards.map((s) => (
              <option key={s} value={s}>
                {standardShortLabels[s]}
              </option>
            ))}
          </SelectInput>
        )}
      </FormField>
      {choice.standard === 'ece-r85' && (
        <div className="grid gap-3 sm:grid-cols-2">
          <FormField label="Engine (for R85)">
            {(c) => (
              <SelectInput
                {...c}
                value={choice.aspiration ?? buildAspiration ?? 'turbocharged'}
                onChange={(e) =>
                  onChange({ ...choice, aspiration: e.target.value as EngineAspiration })
                }
              >
                {engineAspirations.map((a) => (
                  <option key={a} value={a}>
                    {engineAspirationLabels[a]}
                  </option>
                ))}
              </SelectInput>
            )}
          </FormField>
          <FormField
            label="Engine factor f_m when a run cannot give it"
            optional
            hint={`${engineFactorLimits.min} to ${engineFactorLimits.max}; empty uses ${engineFactorLimits.min}, the standard’s lowest`}
            error={
              fmInvalid
                ? `Enter a number from ${engineFactorLimits.min} to ${engineFactorLimits.max}`
                : undefined
            }
          >
            {(c) => (
              <NumberInput
                {...c}
                value={fmText}
                onChange={(e) => setFmText(e.target.value)}
                onNumber={(n) => {
                  if (n === null) onChange({ ...choice, engineFactor: undefined });
                  else if (n >= engineFactorLimits.min && n <= engineFactorLimits.max) {
                    onChange({ ...choice, engineFactor: n });
                  }
                }}
              />
            )}
          </FormField>
        </div>
      )}
    </div>
  );
}

const fmSourceText = {
  computed: 'worked out from the run',
  chosen: 'as you chose it',
  default: 'the standard’s lowest, as none was chosen',
} as const;

/** Which engine factor f_m R85 used for a run, and why. */
export function EngineFactorLine({ correction }: { correction: CorrectionResult }) {
  const fm = correction.engineFactor;
  if (!fm) return null;
  return (
    <p className="text-[15px] text-ink-2" data-testid="engine-factor">
      Engine factor f_m = <strong className="tabular-nums">{formatNumber(fm.value, 4)}</strong>,{' '}
      {fmSourceText[fm.source]}
      {fm.qc != null && (
        <>
          {' '}
          (q_c = {formatNumber(fm.qc, 2)} mg/(L·cycle)
          {fm.qc < 37.2
            ? ', below 37.2, so the floor of 0.3'
            : fm.qc > 65
              ? ', above 65, so the ceiling of 1.2'
              : ', on the line 0.036 q_c − 1.14'}
          )
        </>
      )}
      {fm.reason && <span className="block text-sm text-muted">Why: {fm.reason}.</span>}
    </p>
  );
}

/**
 * One run's correction: the factor, whether it lies in the standard's range, the warnings,
 * for R85 which engine factor was used and why, and the working.
 */
export function CorrectionFigure({
  correction,
  title = 'Correction factor',
}: {
  correction: CorrectionResult;
  title?: string;
}) {
  return (
    <div className="flex flex-col gap-3" data-testid="correction-figure">
      <div className="flex flex-wrap items-end gap-x-4 gap-y-1">
        <div>
          <p className="text-sm font-semibold tracking-wide text-muted uppercase">{title}</p>
          <p className="text-3xl leading-tight font-bold tabular-nums text-ink">
            <span data-testid="correction-factor">{factorText(correction.factor)}</span>
          </p>
        </div>
        <p className="pb-1 text-ink-2">{correction.label}</p>
        {!correction.valid && <Badge tone="over">Outside the standard’s range</Badge>}
        {!correction.applied && <Badge tone="tight">Not corrected</Badge>}
      </div>
      <EngineFactorLine correction={correction} />
      {correction.warnings.map((w) => (
        <Alert key={w.code} tone={w.code === 'outside-valid-range' ? 'error' : 'warning'}>
          {w.message}
        </Alert>
      ))}
      <ShowWorking label={title}>
        <WorkingBody
          title={`${title}, ${correction.label}`}
          value={factorText(correction.factor)}
          working={correction.working}
        />
      </ShowWorking>
      {correction.standard === 'ece-r85' && (
        <p className="text-sm text-muted">
          How f_m is applied: 0.036 q_c − 1.14 for 37.2 ≤ q_c ≤ 65 mg/(L·cycle), 0.3 below and 1.2
          above, as the standard is given in Headroom’s reference. The line gives about 0.2 at 37.2,
          below the 0.3 used just under it, so f_m jumps there; Headroom follows the rule as written
          and shows which f_m each run used.
        </p>
      )}
    </div>
  );
}
