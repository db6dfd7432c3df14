import { useId, useState, type ReactNode } from 'react';
import { Eye, Save, Undo2 } from 'lucide-react';
import { powerBasisLabels } from '@shared/schemas/builds';
import type { EstimateResult } from '@shared/schemas/estimate';
import { formatNumber } from '@shared/format';
import { parseNumber } from '@shared/numbers';
import { Button } from '@/components/ui/button';
import { NumberInput } from '@/components/ui/number-input';
import { formatFigure } from '../format';
import { whatIfRange } from '../what-if';

/**
 * The saved target, and a what-if target to try: a slider and a number box, both in the
 * build's basis (crank or wheel hp). Moving either previews at once; the owner can save the
 * what-if as the build's target.
 */
export function TargetPanel({
  saved,
  preview,
  onPreview,
  onSaveTarget,
  savingTarget,
  saveError,
  previewAnswer,
}: {
  saved: EstimateResult;
  /** The what-if target, or null at the saved target. */
  preview: number | null;
  onPreview: (powerHp: number | null) => void;
  /** Owners only: make the what-if the build's target. */
  onSaveTarget?: (powerHp: number) => void;
  savingTarget?: boolean;
  saveError?: string;
  /** The what-if's answer in brief, shown while a preview is on. */
  previewAnswer?: ReactNode;
}) {
  const id = useId();
  const { target, assumptions: a } = saved;
  const basis = powerBasisLabels[target.basis];
  const range = whatIfRange(saved);
  const current = preview ?? target.powerHp;
  const [text, setText] = useState(String(current));
  const [textFor, setTextFor] = useState(current);
  // Keep the box in step when the slider (or "back to saved") moves the value.
  if (textFor !== current) {
    setTextFor(current);
    if (parseNumber(text) !== current) setText(String(current));
  }
  const typed = parseNumber(text) ?? Number.NaN;
  const typedInvalid = !(typed > 0 && typed <= 5000);

  const set = (value: number) => onPreview(value === target.powerHp ? null : value);

  return (
    <div className="flex flex-col gap-4">
      <div className="flex flex-wrap items-end gap-x-8 gap-y-2">
        <div>
          <p className="text-sm font-semibold tracking-wide text-muted uppercase">Saved target</p>
          <p className="text-3xl leading-tight font-bold tabular-nums text-ink">
            {formatNumber(target.powerHp, 1)}
            <span className="ml-1.5 text-lg font-semibold text-ink-2">{basis}</span>
          </p>
        </div>
        <p className="text-ink-2">
          {target.basis === 'wheel'
            ? `${formatFigure(saved.requirements.crankPower.value, 'hp-crank')} at ${formatNumber(a.drivetrainLossPct, 1)} % drivetrain loss`
            : `${formatFigure(saved.requirements.wheelPower.value, 'hp-wheel')} at ${formatNumber(a.drivetrainLossPct, 1)} % drivetrain loss`}
          <span className="block">
            <TorqueLine saved={saved} />
          </span>
        </p>
      </div>

      <div className="rounded-md border border-rule-strong bg-paper/60 px-3.5 py-3">
        <div className="flex flex-wrap items-baseline justify-between gap-2">
          <label htmlFor={`${id}-range`} className="font-bold text-ink">
            What if the target were…
          </label>
          <span className="text-sm text-muted">Preview only, worked out in your browser</span>
        </div>
        <div className="mt-2 flex flex-col gap-3 sm:flex-row sm:items-center">
          <input
            id={`${id}-range`}
            type="range"
            min={range.min}
            max={range.max}
            step={5}
            value={Math.min(range.max, Math.max(range.min, current))}
            aria-valuetext={`${formatNumber(current, 1)} ${basis}`}
            onChange={(e) => set(Number(e.target.value))}
            className="h-11 w-full min-w-0 flex-1 accent-accent-600"
          />
          <div className="flex items-center gap-2">
            <div className="w-28 shrink-0">
              <NumberInput
                id={`${id}-number`}
                aria-label={`What-if target in ${basis}`}
                aria-invalid={typedInvalid || undefined}
                value={text}
                onChange={(e) => setText(e.target.value)}
                onNumber={(v) => {
                  if (v !== null && v > 0 && v <= 5000) {
                    setTextFor(v);
                    set(v);
                  }
                }}
              />
            </div>
            <span className="font-semibold whitespace-nowrap text-ink-2">{basis}</span>
          </div>
        </div>
        {typedInvalid && (
          <p className="mt-1 text-sm font-semibold text-over">
            Enter a target above 0 and at most 5000 hp.
          </p>
        )}
        {preview !== null ? (
          <div className="mt-3 flex flex-col gap-2 border-t border-rule pt-3">
            <p className="flex items-start gap-2 font-semibold text-accent-700" role="status">
              <Eye aria-hidden className="mt-0.5 size-5 shrink-0" />
              Preview at {formatNumber(preview, 1)} {basis}: not saved. The figures below are this
              what-if; the saved target is {formatNumber(target.powerHp, 1)} {basis}.
            </p>
            {previewAnswer}
            <div className="flex flex-col gap-2 sm:flex-row sm:flex-wrap">
              <Button
                variant="secondary"
                size="sm"
                icon={<Undo2 aria-hidden className="size-4" />}
                onClick={() => onPreview(null)}
              >
                Back to the saved target
              </Button>
              {onSaveTarget && (
                <Button
                  size="sm"
                  icon={<Save aria-hidden className="size-4" />}
                  pending={savingTarget}
                  onClick={() => onSaveTarget(preview)}
                >
                  Make {formatNumber(preview, 1)} {basis} the build’s target
                </Button>
              )}
            </div>
            {saveError && <p className="text-sm font-semibold text-over">{saveError}</p>}
          </div>
        ) : (
          <p className="mt-2 text-sm text-muted">
            Move the slider or type a figure to see what a different target asks of the parts.
          </p>
        )}
      </div>
    </div>
  );
}

/**
 * Which crank torque the torque-rated parts are held to: the larger of the owner's torque
 * target and the torque the power target needs at peak-power rpm, said in words.
 */
function TorqueLine({ saved }: { saved: EstimateResult }) {
  const { target, assumptions: a, requirements: r } = saved;
  const atPeak = `${formatFigure(r.crankTorqueAtPeakPower.value, 'lbf-ft')} at ${formatNumber(a.peakRpm, 0)} rpm`;
  if (target.torqueLbft == null) return <>No torque target: {atPeak} (peak power) is used</>;
  const torqueTarget = formatFigure(target.torqueLbft, 'lbf-ft');
  return target.torqueLbft > r.crankTorqueAtPeakPower.value ? (
    <>
      Torque target {torqueTarget} at the crank, above the {atPeak} at peak power: the target is
      used
    </>
  ) : (
    <>
      Torque target {torqueTarget} at the crank, but peak power needs {atPeak}: the larger is used
    </>
  );
}
