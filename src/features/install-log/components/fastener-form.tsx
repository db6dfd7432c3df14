import { useForm, type Path } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import type { z } from 'zod';
import {
  createFastenerSpecInputSchema,
  fastenerSpecIssues,
  threadConditionLabels,
  threadConditions,
  toleranceTypeLabels,
  torqueDefiningFields,
  type CreateFastenerSpecInput,
  type FastenerSpec,
  type UpdateFastenerSpecInput,
} from '@shared/schemas/install-log';
import { cylinderNames } from '@shared/install-log/positions';
import { toleranceTypes, torqueUnits } from '@shared/install-log/torque';
import { FormActions } from '@/components/ui/form-actions';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { FormField, SelectInput, TextArea, TextInput } from '@/components/ui/form-field';
import { NumberInput } from '@/components/ui/number-input';
import { parseNumber } from '@shared/numbers';
import { applyServerErrors } from '@/lib/form-errors';
import { targetText, unitLabel } from '../lib/format';

// The server's schema, plus the cross-field checks it runs (tolerance below the target,
// stages below the final torque), so the form says so before it sends.
const schema = createFastenerSpecInputSchema.superRefine((spec, ctx) => {
  for (const [path, message] of Object.entries(fastenerSpecIssues(spec))) {
    ctx.addIssue({ code: 'custom', path: [path], message });
  }
});
type Input = z.input<typeof schema>;
type Values = z.output<typeof schema>;
const fieldNames = Object.keys(createFastenerSpecInputSchema.shape) as Path<Input>[];

/** An empty box is "not given" (undefined) for the required numbers, so the schema asks for one. */
const toNumberOrUndefined = (value: unknown) => parseNumber(value) ?? undefined;

/** "15, 25" → [15, 25]; an empty box → no stages. */
function toStages(value: unknown): number[] | undefined {
  if (Array.isArray(value)) return value as number[];
  const text = String(value ?? '').trim();
  if (!text) return undefined;
  // Commas separate stages here, so decimals take a point: "15, 22.5".
  return text
    .split(/[,;\s]+/)
    .filter(Boolean)
    .map((t) => parseNumber(t) ?? Number.NaN);
}

/** "Cyl 1, Cyl 2" → ['Cyl 1', 'Cyl 2']; an empty box → no names (#1 … #n). */
function toNames(value: unknown): string[] {
  if (Array.isArray(value)) return value as string[];
  return String(value ?? '')
    .split(',')
    .map((t) => t.trim())
    .filter(Boolean);
}

/** Any reading recorded against the spec, current, re-check or replaced. */
function hasReadings(spec: FastenerSpec): boolean {
  return spec.positions.some((p) => p.current || p.retorque || p.supersededCount > 0);
}

/** A spec as the form holds it (only the fields the form edits: the schemas are strict). */
function specToFormValues(spec: FastenerSpec): Input {
  return {
    name: spec.name,
    count: spec.count,
    targetValue: spec.targetValue,
    targetUnit: spec.targetUnit,
    toleranceType: spec.toleranceType,
    toleranceValue: spec.toleranceValue,
    // The box shows "15,25"; toStages reads it back the same way.
    stages: spec.stages,
    finalAngleDeg: spec.finalAngleDeg,
    threadCondition: spec.threadCondition,
    sequenceNote: spec.sequenceNote,
    // The box shows "Cyl 1,Cyl 2"; toNames reads it back the same way.
    positionNames: spec.positionNames,
    specSource: spec.specSource,
    retorqueAfterHeatCycles: spec.retorqueAfterHeatCycles,
    retorqueAfterMiles: spec.retorqueAfterMiles,
  };
}

type FastenerFormProps = {
  onCancel: () => void;
} & (
  | {
      spec?: undefined;
      onSubmit: (values: CreateFastenerSpecInput) => Promise<unknown>;
    }
  | {
      /** The spec to edit; the form opens filled from it. */
      spec: FastenerSpec;
      /**
       * The owner may change the target and tolerance under recorded readings (their
       * verdicts change with it); for anyone else the server refuses, so the form locks them.
       */
      canOverride: boolean;
      onSubmit: (values: UpdateFastenerSpecInput) => Promise<unknown>;
    }
);

/** A new fastener spec, or (with `spec`) an edit of one, sending every field it shows. */
export function FastenerForm(props: FastenerFormProps) {
  const { spec, onCancel } = props;
  const read = spec ? hasReadings(spec) : false;
  const torqueLocked = props.spec !== undefined && read && !props.canOverride;
  const {
    register,
    handleSubmit,
    setError,
    setValue,
    watch,
    formState: { errors, isSubmitting },
  } = useForm<Input, unknown, Values>({
    resolver: zodResolver(schema),
    defaultValues: spec
      ? specToFormValues(spec)
      : {
          name: '',
          targetUnit: 'lbf-ft',
          toleranceType: 'percent',
          sequenceNote: '',
          positionNames: [],
          specSource: '',
        },
  });
  const count = watch('count');
  const unit = watch('targetUnit') ?? 'lbf-ft';
  const tolType = watch('toleranceType') ?? 'percent';

  const submit = handleSubmit(async (values) => {
    try {
      if (props.spec === undefined) {
        await props.onSubmit(values);
        return;
      }
      // An empty stages or names box clears them (left out, the server would keep the old ones).
      const input: UpdateFastenerSpecInput = {
        ...values,
        stages: values.stages ?? [],
        positionNames: values.positionNames ?? [],
      };
      if (torqueLocked) for (const key of torqueDefiningFields) delete input[key];
      await props.onSubmit(input);
    } catch (error) {
      applyServerErrors(error, setError, fieldNames);
    }
  });

  const torqueFields = (
    <>
      <FormField label="Target torque" error={errors.targetValue?.message}>
        {(c) => (
          <NumberInput {...c} {...register('targetValue', { setValueAs: toNumberOrUndefined })} />
        )}
      </FormField>
      <FormField label="Unit" error={errors.targetUnit?.message}>
        {(c) => (
          <SelectInput {...c} {...register('targetUnit')}>
            {torqueUnits.map((u) => (
              <option key={u} value={u}>
                {unitLabel(u)}
              </option>
            ))}
          </SelectInput>
        )}
      </FormField>
      <FormField label="Tolerance" error={errors.toleranceType?.message}>
        {(c) => (
          <SelectInput {...c} {...register('toleranceType')}>
            {toleranceTypes.map((t) => (
              <option key={t} value={t}>
                {toleranceTypeLabels[t]}
              </option>
            ))}
          </SelectInput>
        )}
      </FormField>
      <FormField
        label={tolType === 'percent' ? 'Tolerance, ± %' : `Tolerance, ± ${unitLabel(unit)}`}
        error={errors.toleranceValue?.message}
      >
        {(c) => (
          <NumberInput
            {...c}
            {...register('toleranceValue', { setValueAs: toNumberOrUndefined })}
          />
        )}
      </FormField>
    </>
  );

  const stagesError =
    errors.stages?.message ??
    (Array.isArray(errors.stages) ? errors.stages.find((e) => e?.message)?.message : undefined);

  return (
    <form onSubmit={submit} noValidate className="flex flex-col gap-4">
      <Alert tone="info" title="Copy the spec from the service information">
        Torque values, sequences and procedures come from the vehicle maker's service information.
        Headroom records them and checks readings against them; it does not supply them.
      </Alert>
      {spec && read && !torqueLocked && (
        <Alert tone="warning" title="Readings are recorded against this spec">
          A new target or tolerance judges them again: a reading in spec now may come out over or
          under.
        </Alert>
      )}

      <FormField label="Fastener" error={errors.name?.message} hint="e.g. Injector hold-down bolts">
        {(c) => <TextInput {...c} {...register('name')} autoComplete="off" autoFocus />}
      </FormField>

      <div className="grid grid-cols-2 gap-4 sm:grid-cols-3">
        <FormField label="How many" error={errors.count?.message}>
          {(c) => (
            <NumberInput
              {...c}
              {...register('count', { setValueAs: toNumberOrUndefined })}
              integer
            />
          )}
        </FormField>
        {!torqueLocked && torqueFields}
        <FormField label="Threads" error={errors.threadCondition?.message}>
          {(c) => (
            <SelectInput
              {...c}
              {...register('threadCondition')}
              defaultValue={spec ? undefined : ''}
            >
              <option value="" disabled>
                Choose…
              </option>
              {threadConditions.map((t) => (
                <option key={t} value={t}>
                  {threadConditionLabels[t]}
                </option>
              ))}
            </SelectInput>
          )}
        </FormField>
      </div>

      {spec && torqueLocked && (
        <div className="rounded-md border border-rule bg-sheet px-3 py-2">
          <p className="text-[15px] font-semibold text-ink-2">Target and tolerance</p>
          <p className="text-lg font-bold text-ink tabular-nums">{targetText(spec)}</p>
          <p className="text-sm text-muted">
            Readings are recorded against it, so only the owner can change it.
          </p>
        </div>
      )}

      <div className="grid grid-cols-1 gap-4 sm:grid-cols-2">
        <FormField
          label="Stages before the final torque"
          optional
          error={stagesError}
          hint={`In ${unitLabel(unit)}, in order, e.g. 15, 25`}
        >
          {(c) => (
            <TextInput
              {...c}
              {...register('stages', { setValueAs: toStages })}
              inputMode="decimal"
              autoComplete="off"
            />
          )}
        </FormField>
        <FormField
          label="Then turn (degrees)"
          optional
          error={errors.finalAngleDeg?.message}
          hint="For torque-to-angle fasteners"
        >
          {(c) => (
            <NumberInput {...c} {...register('finalAngleDeg', { setValueAs: parseNumber })} />
          )}
        </FormField>
      </div>

      <div className="flex flex-col gap-2">
        <FormField
          label="Position names"
          optional
          error={
            errors.positionNames?.message ??
            (Array.isArray(errors.positionNames)
              ? errors.positionNames.find((e) => e?.message)?.message
              : undefined)
          }
          hint="One per fastener, separated by commas, e.g. Cyl 1, Cyl 2 … Left empty: #1, #2 …"
        >
          {(c) => (
            <TextInput
              {...c}
              {...register('positionNames', { setValueAs: toNames })}
              autoComplete="off"
            />
          )}
        </FormField>
        {typeof count === 'number' && count >= 1 && count <= 16 && (
          <Button
            variant="secondary"
            size="sm"
            className="self-start"
            onClick={() => setValue('positionNames', cylinderNames(count), { shouldDirty: true })}
          >
            Name them Cyl 1 to Cyl {count}
          </Button>
        )}
      </div>

      <FormField
        label="Sequence"
        optional
        error={errors.sequenceNote?.message}
        hint="e.g. Center out, criss-cross; all to stage 1 first"
      >
        {(c) => <TextArea {...c} {...register('sequenceNote')} rows={2} />}
      </FormField>

      <FormField
        label="Where the spec comes from"
        error={errors.specSource?.message}
        hint="The service manual and its section, or the part maker's sheet"
      >
        {(c) => <TextInput {...c} {...register('specSource')} autoComplete="off" />}
      </FormField>

      <fieldset className="rounded-md border border-rule px-3 pt-1 pb-3">
        <legend className="px-1 text-[15px] font-semibold">
          Re-torque check <span className="font-normal text-muted">(optional)</span>
        </legend>
        <div className="grid grid-cols-2 gap-4">
          <FormField label="After heat cycles" error={errors.retorqueAfterHeatCycles?.message}>
            {(c) => (
              <NumberInput
                {...c}
                {...register('retorqueAfterHeatCycles', { setValueAs: parseNumber })}
                integer
              />
            )}
          </FormField>
          <FormField label="Or after miles" error={errors.retorqueAfterMiles?.message}>
            {(c) => (
              <NumberInput
                {...c}
                {...register('retorqueAfterMiles', { setValueAs: parseNumber })}
                integer
              />
            )}
          </FormField>
        </div>
      </fieldset>

      <FormActions
        large
        error={errors.root?.server?.message}
        onCancel={onCancel}
        submitLabel={spec ? 'Save the spec' : 'Add the spec'}
        pending={isSubmitting}
      />
    </form>
  );
}
