import { useId, useState } from 'react';
import { Gauge } from 'lucide-react';
import {
  defaultCalibrationMonths,
  maxCalibrationMonths,
  minCalibrationMonths,
} from '@shared/install-log/wrenches';
import type { Build } from '@shared/schemas/builds';
import { parseNumber } from '@shared/numbers';
import { Button } from '@/components/ui/button';
import { NumberInput } from '@/components/ui/number-input';
import { isApiError } from '@/lib/api-client';
import { useUpdateBuild } from '@/features/builds/api/update-build';

/**
 * How long a torque wrench's calibration holds on this build: readings taken with a wrench
 * past it are flagged (never refused). Everyone sees it; the owner changes it.
 */
export function CalibrationInterval({ build, canChange }: { build: Build; canChange: boolean }) {
  const id = useId();
  const update = useUpdateBuild();
  const [editing, setEditing] = useState(false);
  const [months, setMonths] = useState(String(build.wrenchCalibrationMonths));
  const months0 = build.wrenchCalibrationMonths;
  const error = isApiError(update.error)
    ? (update.error.fields?.wrenchCalibrationMonths ?? update.error.message)
    : update.error?.message;

  return (
    <div className="flex flex-wrap items-center gap-x-3 gap-y-2 rounded-lg border border-rule bg-sheet px-4 py-2.5 text-[15px] text-ink-2 sm:px-5">
      <Gauge aria-hidden className="size-5 shrink-0 text-ink-3" />
      {editing ? (
        <form
          className="flex flex-wrap items-center gap-2"
          onSubmit={(e) => {
            e.preventDefault();
            update.mutate(
              {
                buildId: build.id,
                input: { wrenchCalibrationMonths: parseNumber(months) ?? Number.NaN },
              },
              { onSuccess: () => setEditing(false) },
            );
          }}
        >
          <label htmlFor={id} className="font-semibold text-ink">
            Torque wrenches need calibrating every
          </label>
          <NumberInput
            id={id}
            integer
            value={months}
            onChange={(e) => setMonths(e.target.value)}
            className="w-20!"
            aria-invalid={error ? true : undefined}
            aria-describedby={error ? `${id}-error` : undefined}
          />
          <span>months</span>
          <Button type="submit" size="sm" pending={update.isPending}>
            Save
          </Button>
          <Button variant="ghost" size="sm" onClick={() => setEditing(false)}>
            Cancel
          </Button>
          {error && (
            <p id={`${id}-error`} role="alert" className="w-full font-semibold text-over">
              {error}
            </p>
          )}
          <p className="w-full text-sm text-muted">
            {minCalibrationMonths}–{maxCalibrationMonths} months; {defaultCalibrationMonths} is the
            usual interval for hand torque tools.
          </p>
        </form>
      ) : (
        <>
          <p>
            Torque wrenches need calibrating every{' '}
            <span className="font-semibold text-ink">
              {months0} month{months0 === 1 ? '' : 's'}
            </span>
            : readings with a wrench past that are flagged.
          </p>
          {canChange && (
            <Button
              variant="ghost"
              size="sm"
              onClick={() => {
                update.reset();
                setMonths(String(months0));
                setEditing(true);
              }}
            >
              Change<span className="sr-only"> the calibration interval</span>
            </Button>
          )}
        </>
      )}
    </div>
  );
}
