import { useForm, type UseFormRegisterReturn } from 'react-hook-form';
import {
  boostUnitLabels,
  boostUnits,
  createDynoRunInputSchema,
  dynoPowerUnitLabels,
  dynoPowerUnits,
  dynoTemperatureUnitLabels,
  dynoTemperatureUnits,
  dynoTorqueUnitLabels,
  dynoTorqueUnits,
  mixtureKindLabels,
  mixtureKinds,
  type DynoRun,
  type DynoRunInput,
} from '@shared/schemas/dyno';
import { FormActions } from '@/components/ui/form-actions';
import { FieldGroup, FormField, SelectInput, TextArea } from '@/components/ui/form-field';
import { RunBasicsFields } from './run-basics-fields';
import { NumberInput } from '@/components/ui/number-input';
import { FormError } from '@/components/ui/form-error';
import { Modal } from '@/components/ui/modal';
import { useCreateDynoRun } from '../api/create-dyno-run';
import { useUpdateDynoRun } from '../api/update-dyno-run';
import { applyFieldErrors, schemaResolver } from '../form';
import { WeatherFields } from './weather-fields';

import { defaults, toInput, type RunFormValues } from './run-form-values';

/** A run typed in from the dyno's screen or printout: its peaks, and whatever else was logged. */
export function RunFormDialog({
  open,
  buildId,
  sessionId,
  run,
  onClose,
  onSaved,
}: {
  open: boolean;
  buildId: string;
  sessionId: string;
  run?: DynoRun;
  onClose: () => void;
  onSaved: (run: DynoRun) => void;
}) {
  return (
    <Modal
      open={open}
      onClose={onClose}
      title={run ? `Edit run ${run.runNumber}` : 'Type in a run'}
      description="As measured, before any correction: Headroom corrects on the page."
    >
      {open && (
        <RunForm
          buildId={buildId}
          sessionId={sessionId}
          run={run}
          onCancel={onClose}
          onSaved={onSaved}
        />
      )}
    </Modal>
  );
}

function UnitSelect<T extends string>({
  label,
  options,
  labels,
  field,
  locked,
}: {
  label: string;
  options: readonly T[];
  labels: Record<T, string>;
  field: UseFormRegisterReturn;
  /** A run with a curve keeps the units its file gave: changing one would re-read every row. */
  locked?: boolean;
}) {
  return (
    <FormField label={label} hint={locked ? 'Set by the curve’s file' : undefined}>
      {(c) => (
        <SelectInput {...c} {...field} disabled={locked}>
          {options.map((o) => (
            <option key={o} value={o}>
              {labels[o]}
            </option>
          ))}
        </SelectInput>
      )}
    </FormField>
  );
}

function RunForm({
  buildId,
  sessionId,
  run,
  onCancel,
  onSaved,
}: {
  buildId: string;
  sessionId: string;
  run?: DynoRun;
  onCancel: () => void;
  onSaved: (run: DynoRun) => void;
}) {
  const create = useCreateDynoRun();
  const update = useUpdateDynoRun();
  const curve = run?.curve.length ? run.curve : null;
  const {
    register,
    handleSubmit,
    watch,
    setError,
    getValues,
    formState: { errors, isSubmitting },
  } = useForm<RunFormValues, unknown, DynoRunInput>({
    resolver: schemaResolver(createDynoRunInputSchema, (v: RunFormValues) => toInput(v, run)),
    defaultValues: defaults(run),
    mode: 'onTouched',
  });
  const status = watch('status');
  const ownWeather = watch('ownWeather');

  const submit = handleSubmit(async (input) => {
    try {
      // The curve is not edited here: an edit leaves it as stored.
      const { curve: _curve, ...fields } = input;
      const saved = run
        ? await update.mutateAsync({ buildId, runId: run.id, input: fields })
        : await create.mutateAsync({ buildId, sessionId, input: fields });
      onSaved(saved);
    } catch (error) {
      applyFieldErrors(error, setError, getValues());
    }
  });

  const numberBox = (
    name:
      'peakPower' | 'peakPowerRpm' | 'peakTorque' | 'peakTorqueRpm' | 'boost' | 'egt' | 'mixture',
    label: string,
    hint?: string,
  ) => (
    <FormField label={label} optional hint={hint} error={errors[name]?.message}>
      {(c) => <NumberInput {...c} {...register(name)} />}
    </FormField>
  );

  return (
    <form onSubmit={submit} noValidate className="flex flex-col gap-5">
      <FormError message={errors.root?.server?.message ?? errors.root?.message} />
      <FieldGroup legend="The pull">
        <RunBasicsFields
          status={status}
          bind={(name) => register(name)}
          errors={{
            status: errors.status?.message,
            abortReason: errors.abortReason?.message,
            gear: errors.gear?.message,
            tuneRevision: errors.tuneRevision?.message,
          }}
        />
      </FieldGroup>
      <FieldGroup
        legend="Peaks, as measured"
        description="Leave a peak empty to take it from the curve when the run has one."
      >
        {numberBox('peakPower', 'Peak power')}
        {numberBox('peakPowerRpm', 'rpm at peak power')}
        {numberBox('peakTorque', 'Peak torque')}
        {numberBox('peakTorqueRpm', 'rpm at peak torque')}
        <UnitSelect
          label="Power unit"
          options={dynoPowerUnits}
          labels={dynoPowerUnitLabels}
          field={register('powerUnit')}
          locked={Boolean(curve)}
        />
        <UnitSelect
          label="Torque unit"
          options={dynoTorqueUnits}
          labels={dynoTorqueUnitLabels}
          field={register('torqueUnit')}
          locked={Boolean(curve)}
        />
      </FieldGroup>
      <FieldGroup legend="Also logged" description="Boost is gauge pressure, above the air’s.">
        {numberBox('boost', 'Boost at peak power', 'Used by UN ECE R85 for a turbocharged engine')}
        <UnitSelect
          label="Boost unit"
          options={boostUnits}
          labels={boostUnitLabels}
          field={register('boostUnit')}
          locked={Boolean(curve)}
        />
        {numberBox('egt', 'Highest exhaust gas temperature')}
        <UnitSelect
          label="EGT unit"
          options={dynoTemperatureUnits}
          labels={dynoTemperatureUnitLabels}
          field={register('egtUnit')}
          locked={Boolean(curve)}
        />
        {numberBox('mixture', 'Mixture at peak power')}
        <UnitSelect
          label="Mixture written as"
          options={mixtureKinds}
          labels={mixtureKindLabels}
          field={register('mixtureKind')}
          locked={Boolean(curve)}
        />
        <FormField label="Notes" optional error={errors.notes?.message} className="sm:col-span-2">
          {(c) => <TextArea {...c} rows={2} {...register('notes')} />}
        </FormField>
      </FieldGroup>
      <FieldGroup legend="Weather">
        <label className="flex min-h-11 items-center gap-2 sm:col-span-2">
          <input type="checkbox" className="size-5" {...register('ownWeather')} />
          <span>This run has its own weather (otherwise the session’s applies)</span>
        </label>
        {ownWeather && (
          <div className="sm:col-span-2">
            <WeatherFields
              register={register}
              errors={errors}
              humidityKind={watch('humidityKind')}
            />
          </div>
        )}
      </FieldGroup>
      <FormActions
        onCancel={onCancel}
        submitLabel={run ? 'Save changes' : 'Add run'}
        pending={isSubmitting}
      />
    </form>
  );
}
