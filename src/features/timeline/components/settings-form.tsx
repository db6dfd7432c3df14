import { useId, useState } from 'react';
import { useForm, type Path } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import type { z } from 'zod';
import { knownZones, deviceTimeZone } from '@shared/dates';
import {
  maxBufferDays,
  timelineSettingsInputSchema,
  type Timeline,
} from '@shared/schemas/timeline';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { FormError } from '@/components/ui/form-error';
import { FormField, TextInput } from '@/components/ui/form-field';
import { NumberInput } from '@/components/ui/number-input';
import { parseNumber } from '@shared/numbers';
import { applyServerErrors } from '@/lib/form-errors';
import { useUpdateTimelineSettings } from '../api/update-timeline-settings';

type Input = z.input<typeof timelineSettingsInputSchema>;
type Values = z.output<typeof timelineSettingsInputSchema>;
const fieldNames: Path<Input>[] = ['timeZone', 'bufferDays', 'stepsPerWeek'];

/** A number box's text as the schema wants it: empty is "not given", anything else a number. */
const toNumber = (empty: null | undefined) => (v: unknown) => parseNumber(v) ?? empty;

/** The owner's buffer before the target, pace of install work and the build's time zone. */
export function SettingsForm({ buildId, timeline }: { buildId: string; timeline: Timeline }) {
  const update = useUpdateTimelineSettings();
  const [saved, setSaved] = useState(false);
  const zonesId = useId();
  const here = deviceTimeZone();
  const {
    register,
    handleSubmit,
    setError,
    setValue,
    reset,
    formState: { errors, isSubmitting, isDirty },
  } = useForm<Input, unknown, Values>({
    resolver: zodResolver(timelineSettingsInputSchema),
    defaultValues: {
      timeZone: timeline.timeZoneChosen ? timeline.timeZone : (here ?? timeline.timeZone),
      bufferDays: timeline.settings.bufferDays,
      stepsPerWeek: timeline.settings.stepsPerWeek,
    },
  });
  const submit = handleSubmit(async (input) => {
    setSaved(false);
    try {
      const t = await update.mutateAsync({ buildId, input });
      reset({
        timeZone: t.timeZone,
        bufferDays: t.settings.bufferDays,
        stepsPerWeek: t.settings.stepsPerWeek,
      });
      setSaved(true);
    } catch (error) {
      applyServerErrors(error, setError, fieldNames);
    }
  });
  return (
    <form
      onSubmit={submit}
      onChange={() => setSaved(false)}
      noValidate
      aria-label="Timeline settings"
      className="flex flex-col gap-4"
    >
      <FormField
        label="Time zone"
        error={errors.timeZone?.message}
        hint="“Today”, the countdown, the cut-off and the weekly digest are counted in it."
      >
        {(c) => (
          <div className="flex flex-col gap-2 sm:flex-row">
            <TextInput
              {...c}
              {...register('timeZone')}
              list={zonesId}
              autoComplete="off"
              spellCheck={false}
            />
            {here && (
              <Button
                variant="secondary"
                size="sm"
                onClick={() => setValue('timeZone', here, { shouldDirty: true })}
              >
                Use this device’s
              </Button>
            )}
          </div>
        )}
      </FormField>
      <datalist id={zonesId}>
        {knownZones().map((z) => (
          <option key={z} value={z} />
        ))}
      </datalist>
      <div className="grid gap-4 sm:grid-cols-2">
        <FormField
          label="Buffer before the target (days)"
          error={errors.bufferDays?.message}
          hint={`Parts and send-outs should be back this long before the date; 0 to ${maxBufferDays}.`}
        >
          {(c) => (
            <NumberInput
              {...c}
              {...register('bufferDays', { setValueAs: toNumber(undefined) })}
              integer
            />
          )}
        </FormField>
        <FormField
          label="Install pace (steps a week)"
          optional
          error={errors.stepsPerWeek?.message}
          hint="How many install steps you get through in a week. Empty: jobs are not checked."
        >
          {(c) => (
            <NumberInput {...c} {...register('stepsPerWeek', { setValueAs: toNumber(null) })} />
          )}
        </FormField>
      </div>
      <FormError message={errors.root?.server?.message} />
      {saved && !isDirty && <Alert tone="ok">Saved. The timeline is counted again.</Alert>}
      <div className="flex flex-wrap items-center gap-3">
        <Button type="submit" pending={isSubmitting}>
          Save settings
        </Button>
        {isDirty && <span className="text-sm text-muted">Unsaved changes</span>}
      </div>
    </form>
  );
}
