import { useEffect, useId, useRef, useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { z } from 'zod';
import { torqueUnits, type TorqueUnit } from '@shared/install-log/torque';
import { createReadingInputSchema, type FastenerSpec } from '@shared/schemas/install-log';
import { Button } from '@/components/ui/button';
import { cn } from '@/components/ui/cn';
import { isApiError } from '@/lib/api-client';
import { isQueued, useRecordReading, type RecordedReading } from '../api/record-reading';
import { formatTorque } from '@shared/install-log/torque';
import { parseDecimal, unitLabel } from '../lib/format';

const schema = createReadingInputSchema.pick({ value: true, unit: true, note: true });
type Input = z.input<typeof schema>;
type Values = z.output<typeof schema>;

export type EntryKind = 'first' | 'correction' | 'retorque';

const submitLabels: Record<EntryKind, string> = {
  first: 'Record',
  correction: 'Record correction',
  retorque: 'Record re-check',
};

/**
 * The numeric entry for one position: the value read, its unit (the spec's by default) and,
 * for a correction, why. The wrench and the stage come from the card (the wrench is
 * remembered on this device).
 */
export function ReadingEntry({
  buildId,
  spec,
  position,
  label,
  stage = null,
  kind,
  wrenchId,
  autoFocus,
  layout = 'form',
  onRecorded,
  onCancel,
}: {
  buildId: string;
  spec: FastenerSpec;
  position: number;
  /** The position as people call it: "#3", or "Cyl 3" when the spec names its positions. */
  label: string;
  /** The stage being read (1 = the spec's first), or null for the final torque. */
  stage?: number | null;
  kind: EntryKind;
  /** One of my wrenches, or '' for none. */
  wrenchId: string;
  autoFocus?: boolean;
  /** "row": value, unit and Record on one line (a first reading); "form": with a note. */
  layout?: 'row' | 'form';
  onRecorded: (result: RecordedReading) => void;
  onCancel?: () => void;
}) {
  const record = useRecordReading();
  const id = useId();
  const [kept, setKept] = useState('');
  const inputRef = useRef<HTMLInputElement | null>(null);
  const {
    register,
    handleSubmit,
    reset,
    setError,
    formState: { errors, isSubmitting },
  } = useForm<Input, unknown, Values>({
    resolver: zodResolver(schema),
    defaultValues: { unit: spec.targetUnit, note: '' },
  });

  useEffect(() => {
    if (autoFocus) inputRef.current?.focus();
  }, [autoFocus]);

  const submit = handleSubmit(async (values) => {
    setKept('');
    const unit = values.unit as TorqueUnit;
    try {
      const result = await record.mutateAsync({
        buildId,
        stepId: spec.stepId,
        specId: spec.id,
        label: `${spec.name} ${label}${stage ? `, stage ${stage}` : ''}${kind === 'retorque' ? ' (re-check)' : ''}: ${formatTorque(values.value, unit)}`,
        input: {
          position,
          value: values.value,
          unit: values.unit as TorqueUnit,
          wrenchId: wrenchId || undefined,
          note: values.note || undefined,
          retorque: kind === 'retorque' || undefined,
          stage: stage ?? undefined,
          // Judged against the target shown here: a changed target refuses it, never silently.
          expectedTarget: {
            targetValue: spec.targetValue,
            targetUnit: spec.targetUnit,
            toleranceType: spec.toleranceType,
            toleranceValue: spec.toleranceValue,
          },
        },
      });
      reset({ value: undefined, unit: values.unit, note: '' });
      if (isQueued(result)) {
        // Cleared, so the value kept is not recorded a second time by a second tap.
        if (inputRef.current) inputRef.current.value = '';
        setKept(`${formatTorque(values.value, unit)} kept on this phone: waiting to send.`);
        if (kind !== 'first') onCancel?.();
        return;
      }
      onRecorded(result);
    } catch (error) {
      const fields = isApiError(error) ? (error.fields ?? {}) : {};
      const message =
        fields.value ??
        fields.position ??
        fields.unit ??
        fields.stage ??
        fields.wrenchId ??
        (isApiError(error) ? error.message : 'Could not record that. Try again.');
      setError('value', { type: 'server', message });
    }
  });

  const { ref: valueRef, ...valueField } = register('value', { setValueAs: parseDecimal });
  const errorId = `${id}-error`;
  const error = errors.value?.message ?? errors.unit?.message ?? errors.note?.message;

  const row = layout === 'row';
  const what = stage ? `Stage ${stage} torque` : kind === 'retorque' ? 'Re-check torque' : 'Torque';
  const valueInput = (
    <div className="min-w-0">
      <label htmlFor={`${id}-value`} className="sr-only">
        {what} at {label}
      </label>
      <input
        id={`${id}-value`}
        {...valueField}
        ref={(el) => {
          valueRef(el);
          inputRef.current = el;
        }}
        type="text"
        inputMode="decimal"
        autoComplete="off"
        enterKeyHint="done"
        placeholder={row ? 'Reading' : 'New reading'}
        aria-invalid={error ? true : undefined}
        aria-describedby={error ? errorId : undefined}
        className={cn(
          'block min-h-12 w-full rounded-md border border-rule-strong bg-white px-3 text-xl font-semibold text-ink tabular-nums shadow-inner shadow-ink/[0.03]',
          'placeholder:text-base placeholder:font-normal placeholder:text-ink/45',
          'aria-[invalid=true]:border-over aria-[invalid=true]:ring-1 aria-[invalid=true]:ring-over/40',
        )}
      />
    </div>
  );
  const unitSelect = (
    <div>
      <label htmlFor={`${id}-unit`} className="sr-only">
        Unit at {label}
      </label>
      <select
        id={`${id}-unit`}
        {...register('unit')}
        className="block min-h-12 w-full rounded-md border border-rule-strong bg-white px-1.5 text-base font-semibold text-ink"
      >
        {torqueUnits.map((u) => (
          <option key={u} value={u}>
            {unitLabel(u)}
          </option>
        ))}
      </select>
    </div>
  );
  const submitButton = (
    <Button type="submit" pending={isSubmitting} size="sm" className="min-h-12!">
      {row ? 'Record' : submitLabels[kind]}
      <span className="sr-only">
        {row && kind === 'retorque' ? ' re-check' : ''}
        {stage ? ` stage ${stage}` : ''} {label}
      </span>
    </Button>
  );
  const errorLine = (
    <>
      {error && (
        <p id={errorId} role="alert" className="text-[15px] font-semibold text-over">
          {error}
        </p>
      )}
      <p role="status" className="text-[15px] font-semibold text-ink-2 empty:hidden">
        {kept}
      </p>
    </>
  );

  // A first reading (or re-check) is one row: value, unit, Record.
  if (row) {
    return (
      <form onSubmit={submit} noValidate className="flex min-w-0 flex-col gap-1.5">
        <div className="grid grid-cols-[minmax(0,1fr)_5.5rem_auto] gap-2 sm:grid-cols-[11rem_6rem_auto] sm:justify-start">
          {valueInput}
          {unitSelect}
          {submitButton}
        </div>
        {errorLine}
      </form>
    );
  }

  // A correction or a re-check: the value, unit and a note, then the buttons.
  return (
    <form
      onSubmit={submit}
      noValidate
      className="mt-2 flex flex-col gap-2 rounded-md border border-rule-strong bg-paper p-2.5"
    >
      <p className="text-[15px] font-semibold text-ink">
        {kind === 'retorque'
          ? `Re-check ${label}`
          : `Correct ${label}${stage ? `, stage ${stage}` : ''}`}
        <span className="font-normal text-muted">
          {kind === 'correction' ? ' — the reading above stays in the history, struck through' : ''}
        </span>
      </p>
      <div className="grid grid-cols-[minmax(0,1fr)_5.5rem] gap-2 sm:grid-cols-[11rem_6rem]">
        {valueInput}
        {unitSelect}
      </div>
      <div>
        <label htmlFor={`${id}-note`} className="sr-only">
          Note for {label}
        </label>
        <input
          id={`${id}-note`}
          {...register('note')}
          type="text"
          autoComplete="off"
          placeholder={kind === 'correction' ? 'Why it was redone (optional)' : 'Note (optional)'}
          className="block min-h-12 w-full rounded-md border border-rule-strong bg-white px-3 text-base text-ink"
        />
      </div>
      {errorLine}
      <div className="flex flex-wrap gap-2">
        {submitButton}
        {onCancel && (
          <Button variant="secondary" size="sm" className="min-h-12!" onClick={onCancel}>
            Cancel
          </Button>
        )}
      </div>
    </form>
  );
}
