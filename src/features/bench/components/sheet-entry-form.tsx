import { useId, useMemo, useState } from 'react';
import { useFieldArray, useForm, useWatch, type Path } from 'react-hook-form';
import { FileUp, Plus, Trash2 } from 'lucide-react';
import {
  analyseBenchSheet,
  benchUnitLabels,
  benchUnits,
  parseBenchCsv,
  testPointKindLabels,
  testPointKinds,
  toleranceTypeLabels,
  toleranceTypes,
  type TestPointKind,
} from '@shared/bench';
import {
  fluidTemperatureUnitLabels,
  fluidTemperatureUnits,
  type BenchCellError,
  type CreateBenchSheetInput,
  type InjectorFlag,
} from '@shared/schemas/bench';
import type { Part } from '@shared/schemas/parts';
import { FormActions } from '@/components/ui/form-actions';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { cn } from '@/components/ui/cn';
import { FormField, SelectInput, TextArea, TextInput } from '@/components/ui/form-field';
import { NumberInput } from '@/components/ui/number-input';
import { isApiError } from '@/lib/api-client';
import {
  newPointForm,
  previewPoints,
  sheetResolver,
  toInput,
  withKind,
  type SheetForm,
} from '../lib/sheet-form';
import { SheetStatusBadge } from './sheet-status-badge';
import { ValueGrid, type CellKey, type CellMessages, type PasteReport } from './value-grid';

const occasions = ['As received', 'After rebuild', 'After cleaning', 'Re-test'];

type Props = {
  cylinders: number;
  /** The injector sets the caller may put a sheet on. */
  parts: Pick<Part, 'id' | 'name'>[];
  defaultValues: SheetForm;
  submitLabel: string;
  onSubmit: (input: CreateBenchSheetInput) => Promise<unknown>;
  onCancel: () => void;
};

/** An error message at a dotted path of react-hook-form's nested errors. */
function messageAt(errors: unknown, path: string): string | undefined {
  let node = errors as Record<string, unknown> | undefined;
  for (const key of path.split('.')) {
    if (!node || typeof node !== 'object') return undefined;
    node = node[key] as Record<string, unknown> | undefined;
  }
  const message = (node as { message?: unknown } | undefined)?.message;
  return typeof message === 'string' ? message : undefined;
}

/**
 * A flow-bench sheet typed in as the bench gave it: when and how it was run, its test
 * points, and a grid of values. The page judges the values as they are typed (the same
 * computation the server runs when the sheet is saved).
 */
export function SheetEntryForm({
  cylinders,
  parts,
  defaultValues,
  submitLabel,
  onSubmit,
  onCancel,
}: Props) {
  const resolver = useMemo(() => sheetResolver(cylinders), [cylinders]);
  const {
    register,
    control,
    handleSubmit,
    setValue,
    getValues,
    setError,
    formState: { errors, isSubmitting, submitCount },
  } = useForm<SheetForm, unknown, CreateBenchSheetInput>({
    resolver,
    defaultValues,
    mode: 'onSubmit',
    reValidateMode: 'onChange',
  });
  const { fields, append, remove } = useFieldArray({ control, name: 'points' });
  const watched = useWatch({ control }) as SheetForm;
  const [addKind, setAddKind] = useState<TestPointKind>('opening-pressure');
  const [pasteReport, setPasteReport] = useState<PasteReport | null>(null);
  const [csvReport, setCsvReport] = useState<{ text: string; errors: BenchCellError[] } | null>(
    null,
  );
  const [csvDone, setCsvDone] = useState<string | null>(null);
  const csvId = useId();
  const occasionList = useId();

  // Live: what the values say so far, judged as the server will judge them.
  const { flags, preview } = useMemo(() => {
    const usable = previewPoints(watched);
    const flags = new Map<CellKey, InjectorFlag[]>();
    if (!usable.length) return { flags, preview: null };
    const result = analyseBenchSheet({ points: usable.map((u) => u.point) }, { cylinders });
    result.points.forEach((p, k) =>
      p.injectors.forEach((inj) => {
        if (inj.flags.length) flags.set(`${usable[k]!.index}-${inj.position - 1}`, inj.flags);
      }),
    );
    return { flags, preview: result };
  }, [watched, cylinders]);

  // What cannot be read as typed, at once; after a submit, the schema's messages too.
  const messages: CellMessages = new Map();
  for (const [path, message] of Object.entries(toInput(watched).issues)) {
    const m = /^points\.(\d+)\.values\.(\d+)$/.exec(path);
    if (m) messages.set(`${m[1]}-${m[2]}` as CellKey, message);
  }
  watched.points?.forEach((p, i) =>
    p.values?.forEach((_, j) => {
      const key = `${i}-${j}` as CellKey;
      const m = messageAt(errors, `points.${i}.values.${j}`);
      if (m && !messages.has(key)) messages.set(key, m);
    }),
  );

  const setCell = (point: number, row: number, value: string) =>
    setValue(`points.${point}.values.${row}` as Path<SheetForm>, value, {
      shouldDirty: true,
      shouldValidate: submitCount > 0,
    });

  async function importCsv(file: File) {
    setCsvReport(null);
    setCsvDone(null);
    let text: string;
    try {
      text = new TextDecoder('utf-8', { fatal: true }).decode(await file.arrayBuffer());
    } catch {
      setCsvReport({
        text: `“${file.name}” is not UTF-8 text. Save the CSV as UTF-8 and try again; nothing was filled in.`,
        errors: [],
      });
      return;
    }
    const points = getValues('points');
    const parsed = parseBenchCsv(text, { points, cylinders });
    if (!parsed.ok) {
      setCsvReport({
        text: `“${file.name}” has ${parsed.errors.length} cell${parsed.errors.length === 1 ? '' : 's'} to fix; nothing was filled in.`,
        errors: parsed.errors,
      });
      return;
    }
    parsed.values.forEach((values, i) =>
      values.forEach((v, j) => setCell(i, j, v === null ? '' : String(v))),
    );
    const n = parsed.positions.length;
    setCsvDone(
      `Filled ${n} injector${n === 1 ? '' : 's'} from “${file.name}”. Check the values, then save.`,
    );
  }

  const submit = handleSubmit(async (input) => {
    try {
      await onSubmit(input);
    } catch (error) {
      if (!isApiError(error)) {
        setError('root.server', { message: 'Something unexpected happened. Try again.' });
        return;
      }
      // The server names fields by the same paths as the form (points.2.values.4).
      Object.entries(error.fields ?? {}).forEach(([path, message], i) =>
        setError(path as Path<SheetForm>, { type: 'server', message }, { shouldFocus: i === 0 }),
      );
      setError('root.server', { type: 'server', message: error.message });
    }
  });

  const cellProblems = [...messages.entries()].map(([key, message]) => {
    const [col, row] = key.split('-').map(Number);
    const label = watched.points?.[col!]?.label || `point ${col! + 1}`;
    return { key, text: `Injector ${row! + 1}, ${label}: ${message}` };
  });
  const err = (path: string) => messageAt(errors, path);

  return (
    <form onSubmit={submit} noValidate aria-label="Bench sheet" className="flex flex-col gap-5">
      <fieldset className="rounded-lg border border-rule bg-sheet px-4 pt-2 pb-4 sm:px-5">
        <legend className="px-1 text-base font-bold text-ink">The test</legend>
        <div className="grid grid-cols-1 gap-4 sm:grid-cols-2">
          <FormField label="Injector set" error={err('partId')} className="sm:col-span-2">
            {(c) => (
              <SelectInput {...c} {...register('partId')}>
                <option value="">Choose…</option>
                {parts.map((p) => (
                  <option key={p.id} value={p.id}>
                    {p.name}
                  </option>
                ))}
              </SelectInput>
            )}
          </FormField>
          <FormField
            label="Occasion"
            hint="When in the set’s life it was tested"
            error={err('occasion')}
          >
            {(c) => (
              <>
                <TextInput
                  {...c}
                  list={occasionList}
                  autoComplete="off"
                  {...register('occasion')}
                />
                <datalist id={occasionList}>
                  {occasions.map((o) => (
                    <option key={o} value={o} />
                  ))}
                </datalist>
              </>
            )}
          </FormField>
          <FormField label="Tested on" error={err('testedOn')}>
            {(c) => <TextInput {...c} type="date" {...register('testedOn')} />}
          </FormField>
          <FormField label="Tested by" optional error={err('testedBy')}>
            {(c) => <TextInput {...c} autoComplete="off" {...register('testedBy')} />}
          </FormField>
          <FormField label="Test fluid" optional error={err('fluid')}>
            {(c) => (
              <TextInput
                {...c}
                placeholder="e.g. calibration fluid to ISO 4113"
                autoComplete="off"
                {...register('fluid')}
              />
            )}
          </FormField>
          <FormField label="Fluid temperature" optional error={err('fluidTemperature.value')}>
            {(c) => (
              <div className="flex gap-2">
                <NumberInput {...c} {...register('fluidTemperature.value')} />
                <SelectInput
                  aria-label="Temperature unit"
                  className="w-24! shrink-0"
                  {...register('fluidTemperature.unit')}
                >
                  {fluidTemperatureUnits.map((u) => (
                    <option key={u} value={u}>
                      {fluidTemperatureUnitLabels[u]}
                    </option>
                  ))}
                </SelectInput>
              </div>
            )}
          </FormField>
          <FormField label="Notes" optional error={err('notes')} className="sm:col-span-2">
            {(c) => <TextArea {...c} rows={2} {...register('notes')} />}
          </FormField>
        </div>
      </fieldset>

      <section
        aria-labelledby="values-title"
        className="rounded-lg border border-rule bg-sheet px-4 pt-3 pb-4 sm:px-5"
      >
        <h2 id="values-title" className="text-base font-bold text-ink">
          Values
        </h2>
        <p className="mb-3 text-sm text-muted">
          Enter or Tab moves down a column, as the values are read off the bench. Paste a block
          copied from a spreadsheet into a cell: rows go down the injectors, columns across the
          points. Leave a cell empty when an injector was not measured.
        </p>
        <ValueGrid
          headings={(watched.points ?? []).map((p) => ({
            label: p?.label ?? '',
            unit: p?.unit ?? 'mm3-per-stroke',
          }))}
          cylinders={cylinders}
          register={register}
          setCell={setCell}
          messages={messages}
          flags={flags}
          onPasted={setPasteReport}
        />
        <div className="mt-3 flex flex-col gap-3">
          {pasteReport && (
            <Alert tone={pasteReport.tone === 'ok' ? 'ok' : 'warning'} title={pasteReport.text}>
              {pasteReport.problems.length > 0 && (
                <ul className="list-disc pl-5">
                  {pasteReport.problems.map((p, i) => (
                    <li key={i}>{p}</li>
                  ))}
                </ul>
              )}
            </Alert>
          )}
          {cellProblems.length > 0 && (
            <div role="alert" className="text-[15px] text-over">
              <p className="font-semibold">
                {cellProblems.length === 1 ? 'One cell needs' : `${cellProblems.length} cells need`}{' '}
                fixing:
              </p>
              <ul className="list-disc pl-5">
                {cellProblems.map((p) => (
                  <li key={p.key}>{p.text}</li>
                ))}
              </ul>
            </div>
          )}
          {preview && (
            <div
              className="flex flex-col gap-1 rounded-md border border-rule bg-paper/70 px-3 py-2.5"
              data-testid="sheet-preview"
            >
              <p className="flex flex-wrap items-center gap-2 text-sm font-semibold text-muted">
                Preview, not saved yet <SheetStatusBadge status={preview.status} />
              </p>
              <p className="text-[15px] text-ink">{preview.verdict}</p>
            </div>
          )}
          <div>
            <input
              id={csvId}
              type="file"
              accept=".csv,text/csv"
              className="peer sr-only"
              onChange={(e) => {
                const file = e.target.files?.[0];
                e.target.value = '';
                if (file) void importCsv(file);
              }}
            />
            <label
              htmlFor={csvId}
              className="inline-flex min-h-11 cursor-pointer items-center gap-2 rounded-md border border-rule-strong bg-sheet px-4 text-base font-semibold text-ink shadow-sm peer-focus-visible:outline-3 peer-focus-visible:outline-offset-2 peer-focus-visible:outline-accent-500 hover:border-ink-3"
            >
              <FileUp aria-hidden className="size-4" />
              Fill from a CSV file
            </label>
            <p className="mt-1 text-sm text-muted">
              One row per injector, headed “Position”, then one column per test point headed by its
              label. Every cell is checked before anything is filled in.
            </p>
          </div>
          {csvDone && <Alert tone="ok">{csvDone}</Alert>}
          {csvReport && (
            <Alert tone="error" title={csvReport.text}>
              {csvReport.errors.length > 0 && (
                <ul className="list-disc pl-5">
                  {csvReport.errors.map((e, i) => (
                    <li key={i}>
                      {e.row !== null && `Row ${e.row}`}
                      {e.columnName ? `, ${e.columnName}` : e.column ? `, column ${e.column}` : ''}
                      {e.row !== null && ': '}
                      {e.message}
                    </li>
                  ))}
                </ul>
              )}
            </Alert>
          )}
        </div>
      </section>

      <section
        aria-labelledby="points-title"
        className="rounded-lg border border-rule bg-sheet px-4 pt-3 pb-4 sm:px-5"
      >
        <h2 id="points-title" className="text-base font-bold text-ink">
          Test points
        </h2>
        <p className="mb-3 text-sm text-muted">
          Each column of the grid. Tolerances start at Headroom’s defaults; set the maker’s own
          where the sheet gives them.
        </p>
        {err('points') && <p className="mb-2 font-semibold text-over">{err('points')}</p>}
        <ol className="flex flex-col gap-2">
          {fields.map((field, i) => {
            const p = watched.points?.[i];
            const pointError = [
              'kind',
              'label',
              'unit',
              'strokesPerMin',
              'condition',
              'nominal',
              'tolerance.type',
              'tolerance.value',
              'returnLimit',
            ].some((f) => err(`points.${i}.${f}`));
            return (
              <li key={field.id}>
                <details
                  open={pointError || undefined}
                  className={cn(
                    'group rounded-md border bg-white',
                    pointError ? 'border-over' : 'border-rule-strong',
                  )}
                >
                  <summary className="flex min-h-11 cursor-pointer list-none items-center justify-between gap-2 px-3 py-2 [&::-webkit-details-marker]:hidden">
                    <span className="min-w-0">
                      <span className="font-bold">{p?.label || `Point ${i + 1}`}</span>{' '}
                      <span className="text-sm text-muted">
                        {p && benchUnitLabels[p.unit]} ·{' '}
                        {p?.tolerance?.type === 'percent'
                          ? `±${p.tolerance.value || '?'} %`
                          : `±${p?.tolerance?.value || '?'}`}
                      </span>
                    </span>
                    <span className="text-sm font-semibold text-accent-700 group-open:hidden">
                      Settings
                    </span>
                  </summary>
                  <div className="grid grid-cols-1 gap-3 border-t border-rule px-3 py-3 sm:grid-cols-2">
                    <FormField label="Kind" error={err(`points.${i}.kind`)}>
                      {(c) => (
                        <SelectInput
                          {...c}
                          value={p?.kind}
                          onChange={(e) =>
                            setValue(
                              `points.${i}`,
                              withKind(getValues(`points.${i}`), e.target.value as TestPointKind),
                              { shouldDirty: true },
                            )
                          }
                        >
                          {testPointKinds.map((k) => (
                            <option key={k} value={k}>
                              {testPointKindLabels[k]}
                            </option>
                          ))}
                        </SelectInput>
                      )}
                    </FormField>
                    <FormField label="Label" error={err(`points.${i}.label`)}>
                      {(c) => (
                        <TextInput {...c} autoComplete="off" {...register(`points.${i}.label`)} />
                      )}
                    </FormField>
                    <FormField label="Unit" error={err(`points.${i}.unit`)}>
                      {(c) => (
                        <SelectInput {...c} {...register(`points.${i}.unit`)}>
                          {benchUnits.map((u) => (
                            <option key={u} value={u}>
                              {benchUnitLabels[u]}
                            </option>
                          ))}
                        </SelectInput>
                      )}
                    </FormField>
                    <FormField
                      label="Condition"
                      optional
                      hint="e.g. 1,600 bar, 1,800 µs"
                      error={err(`points.${i}.condition`)}
                    >
                      {(c) => (
                        <TextInput
                          {...c}
                          autoComplete="off"
                          {...register(`points.${i}.condition`)}
                        />
                      )}
                    </FormField>
                    <FormField
                      label="Tolerance"
                      error={
                        err(`points.${i}.tolerance.value`) ?? err(`points.${i}.tolerance.type`)
                      }
                    >
                      {(c) => (
                        <div className="flex gap-2">
                          <SelectInput
                            aria-label="Tolerance type"
                            className="w-auto! min-w-0 shrink"
                            {...register(`points.${i}.tolerance.type`)}
                          >
                            {toleranceTypes.map((t) => (
                              <option key={t} value={t}>
                                {toleranceTypeLabels[t]}
                              </option>
                            ))}
                          </SelectInput>
                          <NumberInput
                            {...c}
                            className="w-24! shrink-0"
                            {...register(`points.${i}.tolerance.value`)}
                          />
                        </div>
                      )}
                    </FormField>
                    {p?.kind === 'return-flow' ? (
                      <FormField
                        label="Maker’s return-flow limit"
                        optional
                        error={err(`points.${i}.returnLimit`)}
                      >
                        {(c) => <NumberInput {...c} {...register(`points.${i}.returnLimit`)} />}
                      </FormField>
                    ) : (
                      <FormField label="Maker’s figure" optional error={err(`points.${i}.nominal`)}>
                        {(c) => <NumberInput {...c} {...register(`points.${i}.nominal`)} />}
                      </FormField>
                    )}
                    {p?.unit === 'ml-per-min' && (
                      <FormField
                        label="Strokes per minute"
                        error={err(`points.${i}.strokesPerMin`)}
                      >
                        {(c) => <NumberInput {...c} {...register(`points.${i}.strokesPerMin`)} />}
                      </FormField>
                    )}
                    <div className="sm:col-span-2">
                      <Button
                        variant="ghost"
                        size="sm"
                        disabled={fields.length <= 1}
                        icon={<Trash2 aria-hidden className="size-4" />}
                        onClick={() => remove(i)}
                      >
                        Remove this point
                      </Button>
                    </div>
                  </div>
                </details>
              </li>
            );
          })}
        </ol>
        <div className="mt-3 flex flex-wrap items-end gap-2">
          <FormField label="Add a test point" className="w-56">
            {(c) => (
              <SelectInput
                {...c}
                value={addKind}
                onChange={(e) => setAddKind(e.target.value as TestPointKind)}
              >
                {testPointKinds.map((k) => (
                  <option key={k} value={k}>
                    {testPointKindLabels[k]}
                  </option>
                ))}
              </SelectInput>
            )}
          </FormField>
          <Button
            variant="secondary"
            icon={<Plus aria-hidden className="size-4" />}
            disabled={fields.length >= 30}
            onClick={() => append(newPointForm(addKind, cylinders))}
          >
            Add
          </Button>
        </div>
      </section>

      <FormActions
        layout="start"
        error={errors.root?.server?.message}
        onCancel={onCancel}
        submitLabel={submitLabel}
        pending={isSubmitting}
      />
    </form>
  );
}
