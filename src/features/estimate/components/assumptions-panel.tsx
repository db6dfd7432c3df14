import { useState } from 'react';
import { useForm, type Path } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import type { z } from 'zod';
import { CircleCheck, RotateCcw } from 'lucide-react';
import { assumptionSpecs, bsfcRangeMessage, bsfcSpec, defaultBsfc } from '@shared/estimate';
import {
  assumptionsInputSchema,
  bsfcUnitLabels,
  bsfcUnits,
  type Assumptions,
  type BsfcUnit,
  type EstimateResult,
} from '@shared/schemas/estimate';
import { convertBsfc } from '@shared/units/convert';
import { formatNumber } from '@shared/format';
import { parseNumber } from '@shared/numbers';
import { Button } from '@/components/ui/button';
import { FormError } from '@/components/ui/form-error';
import { FormField } from '@/components/ui/form-field';
import { NumberInput, UnitInput } from '@/components/ui/number-input';
import { PageSpinner } from '@/components/ui/spinner';
import { ErrorState } from '@/components/ui/states';
import { applyServerErrors } from '@/lib/form-errors';
import { useAssumptions } from '../api/get-assumptions';
import { useUpdateAssumptions } from '../api/update-assumptions';
import { formatFigure } from '../format';

type FormInput = z.input<typeof assumptionsInputSchema>;
type FormOutput = z.output<typeof assumptionsInputSchema>;

const fieldNames: Path<FormInput>[] = [
  'bsfc',
  'bsfcUnit',
  'afr',
  'fuelDensityKgPerL',
  'drivetrainLossPct',
  'peakRpm',
  'tightMarginPct',
];

/** The simple assumptions, in the order the chain uses them. */
const simpleFields = [
  { name: 'afr', suffix: ':1' },
  { name: 'fuelDensityKgPerL', suffix: 'kg/L' },
  { name: 'drivetrainLossPct', suffix: '%' },
  { name: 'peakRpm', suffix: 'rpm' },
  { name: 'tightMarginPct', suffix: '%' },
] as const;

/** An empty or unreadable box is NaN, so the schema says "Enter the …" instead of using a default. */
const toNumber = (value: unknown): number => parseNumber(value) ?? Number.NaN;

function roundBsfc(value: number, unit: BsfcUnit): number {
  return unit === 'g-per-kwh' ? Math.round(value * 10) / 10 : Math.round(value * 1000) / 1000;
}

function Source({ text }: { text: string }) {
  return (
    <details className="text-sm text-muted">
      <summary className="cursor-pointer font-semibold text-ink-3 hover:underline">
        Where the default comes from
      </summary>
      <p className="mt-1">{text}</p>
    </details>
  );
}

/**
 * The estimator's assumptions. The owner edits them (Save replaces the set; "Reset to
 * defaults" saves the defaults); everyone else reads them with each default and its source.
 */
export function AssumptionsPanel({
  buildId,
  canEdit,
  saved,
}: {
  buildId: string;
  canEdit: boolean;
  saved: EstimateResult;
}) {
  if (!canEdit) return <AssumptionsReadOnly saved={saved} />;
  return <AssumptionsEditor buildId={buildId} cylinders={saved.assumptions.cylinders} />;
}

function AssumptionsEditor({ buildId, cylinders }: { buildId: string; cylinders: number }) {
  const query = useAssumptions(buildId);
  // Kept here: the form below starts afresh after each save, the note should outlive it.
  const [savedNote, setSavedNote] = useState<string | null>(null);
  if (query.isPending) return <PageSpinner label="Loading the assumptions…" />;
  if (query.isError) {
    return (
      <ErrorState
        title="Could not load the assumptions"
        error={query.error}
        onRetry={() => void query.refetch()}
      />
    );
  }
  return (
    <AssumptionsForm
      // A fresh form whenever the saved set changes (after Save or Reset).
      key={JSON.stringify(query.data.assumptions)}
      buildId={buildId}
      values={query.data.assumptions}
      isDefault={query.data.isDefault}
      cylinders={cylinders}
      savedNote={savedNote}
      setSavedNote={setSavedNote}
    />
  );
}

function isAllDefault(a: Assumptions): boolean {
  return (
    Math.abs(convertBsfc(a.bsfc, a.bsfcUnit, 'lb-per-hp-h') - bsfcSpec.default) < 1e-9 &&
    simpleFields.every((f) => a[f.name] === assumptionSpecs[f.name].default)
  );
}

function AssumptionsForm({
  buildId,
  values,
  isDefault,
  cylinders,
  savedNote,
  setSavedNote,
}: {
  buildId: string;
  values: Assumptions;
  isDefault: boolean;
  cylinders: number;
  savedNote: string | null;
  setSavedNote: (note: string | null) => void;
}) {
  const update = useUpdateAssumptions();
  const {
    register,
    handleSubmit,
    watch,
    setError,
    formState: { errors, isSubmitting, isDirty },
  } = useForm<FormInput, unknown, FormOutput>({
    resolver: zodResolver(assumptionsInputSchema),
    defaultValues: values,
    mode: 'onTouched',
  });
  const bsfcUnit = (watch('bsfcUnit') ?? 'lb-per-hp-h') as BsfcUnit;
  const numeric = { setValueAs: toNumber };

  const submit = handleSubmit(async (input) => {
    setSavedNote(null);
    try {
      await update.mutateAsync({ buildId, input });
      setSavedNote('Saved. The estimate above uses these now.');
    } catch (error) {
      applyServerErrors(error, setError, fieldNames);
    }
  });

  const reset = async () => {
    setSavedNote(null);
    try {
      await update.mutateAsync({ buildId, input: {} });
      setSavedNote('Back to the defaults. The estimate above uses them now.');
    } catch (error) {
      applyServerErrors(error, setError, fieldNames);
    }
  };

  const allDefault = isAllDefault(values);

  return (
    <form onSubmit={submit} noValidate className="flex flex-col gap-4">
      <p className="text-[15px] text-ink-2">
        {isDefault
          ? 'The build uses the defaults. Change any of them to suit the engine and save.'
          : allDefault
            ? 'Saved for this build, all at their defaults.'
            : 'Saved for this build. Reset to go back to the defaults.'}
      </p>
      <div className="grid grid-cols-1 gap-4 sm:grid-cols-2">
        <div className="flex flex-col gap-1">
          <FormField
            label={bsfcSpec.label}
            error={errors.bsfc?.message}
            hint={
              <>
                Default {formatFigure(roundBsfc(defaultBsfc(bsfcUnit), bsfcUnit), bsfcUnit, 3)}.{' '}
                {bsfcRangeMessage(bsfcUnit)}.
              </>
            }
          >
            {(control) => (
              <UnitInput
                {...control}
                {...register('bsfc', numeric)}
                unitLabel="Unit of brake specific fuel consumption"
                units={bsfcUnits}
                unitLabels={bsfcUnitLabels}
                unitSelect={register('bsfcUnit')}
                // Same fuel, other unit: convert the figure in the box rather than reinterpret it.
                convert={(value, from, to) => roundBsfc(convertBsfc(value, from, to), to)}
              />
            )}
          </FormField>
          <Source text={bsfcSpec.source} />
        </div>
        {simpleFields.map(({ name, suffix }) => {
          const spec = assumptionSpecs[name];
          return (
            <div key={name} className="flex flex-col gap-1">
              <FormField
                label={spec.label}
                error={errors[name]?.message}
                hint={`Default ${formatFigure(spec.default, spec.unit)}. Between ${formatNumber(spec.min, 3)} and ${formatNumber(spec.max, 3)}.`}
              >
                {(control) => (
                  <NumberInput {...control} unit={suffix} {...register(name, numeric)} />
                )}
              </FormField>
              <Source text={spec.source} />
            </div>
          );
        })}
      </div>
      <p className="text-[15px] text-ink-2">
        Cylinders: <strong>{cylinders}</strong>, from the build (change it on the build’s edit
        page).
      </p>
      <FormError message={errors.root?.server?.message} />
      {savedNote && !isDirty && (
        <p role="status" className="flex items-center gap-1.5 font-semibold text-ok">
          <CircleCheck aria-hidden className="size-5" />
          {savedNote}
        </p>
      )}
      <div className="flex flex-col gap-2 sm:flex-row">
        <Button type="submit" pending={isSubmitting} disabled={update.isPending}>
          Save assumptions
        </Button>
        <Button
          variant="secondary"
          icon={<RotateCcw aria-hidden className="size-4" />}
          onClick={() => void reset()}
          pending={update.isPending && !isSubmitting}
          disabled={isSubmitting || (allDefault && !isDirty)}
        >
          Reset to defaults
        </Button>
      </div>
    </form>
  );
}

/** For crew, shops and viewers: each assumption with its default and where that comes from. */
function AssumptionsReadOnly({ saved }: { saved: EstimateResult }) {
  return (
    <div className="flex flex-col gap-3">
      <p className="text-[15px] text-ink-2">Only an owner can change these.</p>
      <dl className="grid gap-x-6 sm:grid-cols-2">
        {saved.assumptionDetails.map((d) => (
          <div key={d.key} className="border-b border-rule py-2.5">
            <dt className="text-sm font-semibold tracking-wide text-muted uppercase">{d.label}</dt>
            <dd>
              <span className="text-lg font-bold tabular-nums text-ink">
                {formatFigure(d.value, d.unit, 3)}
              </span>{' '}
              <span className="text-ink-2">
                {d.key === 'cylinders'
                  ? '(from the build)'
                  : d.isDefault
                    ? '(the default)'
                    : `(default ${formatFigure(d.default, d.unit, 3)})`}
              </span>
              <details className="text-sm text-muted">
                <summary className="inline-flex min-h-11 cursor-pointer items-center font-semibold text-ink-3 hover:underline">
                  Source
                </summary>
                <p>{d.source}</p>
              </details>
            </dd>
          </div>
        ))}
      </dl>
    </div>
  );
}
