import { useId, useRef, useState } from 'react';
import { FileUp } from 'lucide-react';
import {
  completeCurve,
  parseCurveCsv,
  runPeaks,
  type CurveCsvError,
  type CurveCsvResult,
} from '../../../../shared/dyno';
import {
  MAX_CURVE_CSV_BYTES,
  MAX_CURVE_ROWS,
  boostUnitLabels,
  defaultRunUnits,
  dynoTemperatureUnitLabels,
  mixtureKindLabels,
  runStatusLabels,
  runStatuses,
  type DynoRun,
  type RunStatus,
  type RunUnits,
} from '../../../../shared/schemas/dyno';
import { formatNumber } from '../../../../shared/format';
import { FormActions } from '../../../components/ui/form-actions';
import { Alert } from '../../../components/ui/alert';
import { FormField, SelectInput, TextInput } from '../../../components/ui/form-field';
import { Modal } from '../../../components/ui/modal';
import { Spinner } from '../../../components/ui/spinner';
import { useImportDynoRun } from '../api/import-dyno-run';
import { useReplaceDynoCurve } from '../api/replace-dyno-curve';
import { UploadError } from '../../../lib/upload';
import { powerText, rpmText, torqueText } from '../format';

const previewRows = 12;

type Read =
  | { kind: 'reading' }
  | { kind: 'file'; message: string }
  | { kind: 'parsed'; file: File; result: CurveCsvResult };

/** Reads a chosen file as the server will: at most 2 MB, UTF-8, then the shared parser. */
async function readCsv(file: File): Promise<Read> {
  if (file.size > MAX_CURVE_CSV_BYTES) {
    return {
      kind: 'file',
      message: `${file.name} is larger than 2 MB; split it or thin the rows.`,
    };
  }
  let text: string;
  try {
    text = new TextDecoder('utf-8', { fatal: true }).decode(await file.arrayBuffer());
  } catch {
    return {
      kind: 'file',
      message: `${file.name} is not UTF-8 text. Save the CSV as UTF-8 and choose it again.`,
    };
  }
  return { kind: 'parsed', file, result: parseCurveCsv(text) };
}

function unitsOf(result: Extract<CurveCsvResult, { ok: true }>): RunUnits {
  const u = result.units;
  return {
    powerUnit: u.powerUnit ?? defaultRunUnits.powerUnit,
    torqueUnit: u.torqueUnit ?? defaultRunUnits.torqueUnit,
    boostUnit: u.boostUnit ?? defaultRunUnits.boostUnit,
    egtUnit: u.egtUnit ?? defaultRunUnits.egtUnit,
    mixtureKind: u.mixtureKind ?? defaultRunUnits.mixtureKind,
  };
}

function ErrorTable({ errors, total }: { errors: CurveCsvError[]; total: number }) {
  return (
    <div className="max-h-[40vh] overflow-auto rounded-lg border border-rule bg-sheet">
      <table className="w-full border-collapse text-left text-[15px]">
        <caption className="sr-only">Rows that need fixing</caption>
        <thead className="sticky top-0 bg-paper">
          <tr className="border-b border-rule-strong text-sm">
            <th scope="col" className="px-3 py-2">
              Row
            </th>
            <th scope="col" className="px-3 py-2">
              Column
            </th>
            <th scope="col" className="px-3 py-2">
              Problem
            </th>
          </tr>
        </thead>
        <tbody>
          {errors.map((e, i) => (
            <tr key={i} className="border-b border-rule last:border-b-0">
              <td className="px-3 py-2 align-top font-semibold tabular-nums">
                {e.row ?? 'Header'}
              </td>
              <td className="px-3 py-2 align-top">{e.column ? <code>{e.column}</code> : '—'}</td>
              <td className="px-3 py-2 align-top [overflow-wrap:anywhere] text-over">
                {e.message}
              </td>
            </tr>
          ))}
        </tbody>
      </table>
      {total > errors.length && (
        <p className="px-3 py-2 text-sm text-muted">
          The first {errors.length} of {total} problems are listed.
        </p>
      )}
    </div>
  );
}

/** What the file holds, before anything is saved: units, rows, peaks and the first rows. */
function Preview({ result }: { result: Extract<CurveCsvResult, { ok: true }> }) {
  const units = unitsOf(result);
  const rows = completeCurve(result.rows, units.powerUnit, units.torqueUnit);
  const peaks = runPeaks({ ...units, curve: result.rows });
  const logged = [
    result.units.boostUnit && `boost in ${boostUnitLabels[result.units.boostUnit]}`,
    result.units.egtUnit && `EGT in ${dynoTemperatureUnitLabels[result.units.egtUnit]}`,
    result.units.mixtureKind && mixtureKindLabels[result.units.mixtureKind].toLowerCase(),
  ].filter(Boolean);
  return (
    <div className="flex flex-col gap-3" data-testid="csv-preview">
      <Alert tone="ok" title={`${formatNumber(result.rows.length, 0)} rows are ready`}>
        From {rpmText(rows[0].rpm)} to {rpmText(rows[rows.length - 1].rpm)}
        {logged.length ? `, with ${logged.join(', ')}` : ''}. Nothing is saved yet.
        {result.reordered && (
          <span className="block">The rows were not in rpm order; they are saved sorted.</span>
        )}
      </Alert>
      <dl className="grid grid-cols-1 gap-x-6 gap-y-1 sm:grid-cols-2">
        <div>
          <dt className="text-sm font-semibold text-muted uppercase">Peak power, as measured</dt>
          <dd className="font-semibold tabular-nums">
            {peaks.power != null && peaks.powerRpm != null
              ? `${powerText(peaks.power, units.powerUnit)} at ${rpmText(peaks.powerRpm)}`
              : '—'}
          </dd>
        </div>
        <div>
          <dt className="text-sm font-semibold text-muted uppercase">Peak torque, as measured</dt>
          <dd className="font-semibold tabular-nums">
            {peaks.torque != null && peaks.torqueRpm != null
              ? `${torqueText(peaks.torque, units.torqueUnit)} at ${rpmText(peaks.torqueRpm)}`
              : '—'}
          </dd>
        </div>
      </dl>
      <div className="max-h-[40vh] overflow-auto rounded-lg border border-rule bg-sheet">
        <table className="w-full border-collapse text-left text-[15px] tabular-nums">
          <caption className="sr-only">The first rows, sorted by rpm</caption>
          <thead className="sticky top-0 bg-paper">
            <tr className="border-b border-rule-strong text-sm">
              <th scope="col" className="px-3 py-2">
                rpm
              </th>
              <th scope="col" className="px-3 py-2 text-right">
                Power
              </th>
              <th scope="col" className="px-3 py-2 text-right">
                Torque
              </th>
            </tr>
          </thead>
          <tbody>
            {rows.slice(0, previewRows).map((r, i) => (
              <tr key={i} className="border-b border-rule last:border-b-0">
                <td className="px-3 py-1.5">{formatNumber(r.rpm, 0)}</td>
                <td className="px-3 py-1.5 text-right">
                  {formatNumber(r.power, 1)}
                  {r.computed === 'power' && <span className="text-muted"> *</span>}
                </td>
                <td className="px-3 py-1.5 text-right">
                  {formatNumber(r.torque, 1)}
                  {r.computed === 'torque' && <span className="text-muted"> *</span>}
                </td>
              </tr>
            ))}
          </tbody>
        </table>
        <p className="px-3 py-2 text-sm text-muted">
          {rows.length > previewRows ? `The first ${previewRows} of ${rows.length} rows. ` : ''}
          In {units.powerUnit === 'hp' ? 'hp' : units.powerUnit === 'kw' ? 'kW' : 'PS'} and{' '}
          {units.torqueUnit === 'lbf-ft' ? 'lbf·ft' : 'N·m'}, as in the file. * worked out from the
          other by P = 2πnT/60.
        </p>
      </div>
    </div>
  );
}

/**
 * A curve from a CSV file: read in the browser with the same parser the server uses, so
 * every problem shows by row and column before anything is sent; then the server reads it
 * again and saves it whole, or not at all. `replace` puts the curve on an existing run.
 */
export function ImportRunDialog({
  open,
  buildId,
  sessionId,
  replace,
  onClose,
  onSaved,
}: {
  open: boolean;
  buildId: string;
  sessionId: string;
  replace?: DynoRun;
  onClose: () => void;
  onSaved: (run: DynoRun) => void;
}) {
  return (
    <Modal
      open={open}
      onClose={onClose}
      wide
      title={replace ? `Replace the curve of run ${replace.runNumber}` : 'Import a run from CSV'}
      description="Power and torque as measured. Nothing is saved until you have seen the rows."
    >
      {open && (
        <ImportRunForm
          buildId={buildId}
          sessionId={sessionId}
          replace={replace}
          onCancel={onClose}
          onSaved={onSaved}
        />
      )}
    </Modal>
  );
}

function ImportRunForm({
  buildId,
  sessionId,
  replace,
  onCancel,
  onSaved,
}: {
  buildId: string;
  sessionId: string;
  replace?: DynoRun;
  onCancel: () => void;
  onSaved: (run: DynoRun) => void;
}) {
  const importRun = useImportDynoRun();
  const replaceCurve = useReplaceDynoCurve();
  const saving = importRun.isPending || replaceCurve.isPending;
  const [read, setRead] = useState<Read | null>(null);
  const [serverError, setServerError] = useState<UploadError | Error | null>(null);
  const [status, setStatus] = useState<RunStatus>('complete');
  const [abortReason, setAbortReason] = useState('');
  const [gear, setGear] = useState('');
  const [tuneRevision, setTuneRevision] = useState('');
  const [fieldErrors, setFieldErrors] = useState<Record<string, string>>({});
  const inputRef = useRef<HTMLInputElement>(null);
  const inputId = useId();

  async function choose(file: File) {
    setServerError(null);
    setRead({ kind: 'reading' });
    setRead(await readCsv(file));
  }

  const ready = read?.kind === 'parsed' && read.result.ok ? read : null;

  async function save() {
    if (!ready) return;
    setServerError(null);
    setFieldErrors({});
    if (!replace && status === 'aborted' && abortReason.trim() === '') {
      setFieldErrors({ abortReason: 'Say why the run was stopped' });
      return;
    }
    try {
      const result = replace
        ? await replaceCurve.mutateAsync({ buildId, runId: replace.id, file: ready.file })
        : await importRun.mutateAsync({
            buildId,
            sessionId,
            file: ready.file,
            fields: {
              status,
              abortReason: status === 'aborted' ? abortReason : null,
              gear,
              tuneRevision,
            },
          });
      onSaved(result.run);
    } catch (error) {
      if (error instanceof UploadError && error.fields) setFieldErrors(error.fields);
      setServerError(error instanceof Error ? error : new Error('The import failed.'));
    }
  }

  const serverRows = serverError instanceof UploadError ? serverError.rows : [];

  return (
    <div className="flex flex-col gap-4">
      <div className="flex flex-col gap-2 rounded-lg border border-rule bg-sheet p-4">
        <label htmlFor={inputId} className="font-semibold">
          Curve CSV file
        </label>
        <input
          ref={inputRef}
          id={inputId}
          type="file"
          accept=".csv,text/csv"
          disabled={saving}
          onChange={(e) => {
            const next = e.target.files?.[0];
            if (next) void choose(next);
          }}
          className="block min-h-11 w-full text-[15px] file:mr-3 file:min-h-11 file:cursor-pointer file:rounded-md file:border file:border-rule-strong file:bg-paper file:px-4 file:font-semibold file:text-ink"
        />
        <p className="text-sm text-muted">
          UTF-8, at most 2 MB and {formatNumber(MAX_CURVE_ROWS, 0)} rows. A header of{' '}
          <code>rpm</code>, <code>power_hp</code> (or <code>_kw</code>, <code>_ps</code>) and/or{' '}
          <code>torque_lbft</code> (or <code>_nm</code>); optional <code>boost_psi</code> (
          <code>_bar</code>, <code>_kpa</code>), <code>egt_f</code> (<code>_c</code>) and{' '}
          <code>afr</code> or <code>lambda</code>. Figures as measured: a column marked corrected is
          refused, so nothing is corrected twice.
        </p>
      </div>

      {read?.kind === 'reading' && (
        <p role="status" className="flex items-center gap-2 text-muted">
          <Spinner className="size-5" /> Reading the file…
        </p>
      )}
      {read?.kind === 'file' && (
        <Alert tone="error" title="This file cannot be imported">
          {read.message}
        </Alert>
      )}
      {read?.kind === 'parsed' && !read.result.ok && (
        <>
          <Alert tone="error" title="Some rows need fixing">
            {read.result.errorCount === 1
              ? '1 problem'
              : `${formatNumber(read.result.errorCount, 0)} problems`}
            . Fix the file and choose it again; nothing was saved.
          </Alert>
          <ErrorTable errors={read.result.errors} total={read.result.errorCount} />
        </>
      )}
      {ready && ready.result.ok && <Preview result={ready.result} />}

      {!replace && (
        <div className="grid grid-cols-1 gap-4 rounded-lg border border-rule bg-sheet p-4 sm:grid-cols-2">
          <FormField label="Status">
            {(c) => (
              <SelectInput
                {...c}
                value={status}
                onChange={(e) => setStatus(e.target.value as RunStatus)}
              >
                {runStatuses.map((s) => (
                  <option key={s} value={s}>
                    {runStatusLabels[s]}
                  </option>
                ))}
              </SelectInput>
            )}
          </FormField>
          {status === 'aborted' && (
            <FormField label="Why it was stopped" error={fieldErrors.abortReason}>
              {(c) => (
                <TextInput
                  {...c}
                  value={abortReason}
                  onChange={(e) => setAbortReason(e.target.value)}
                />
              )}
            </FormField>
          )}
          <FormField label="Gear" optional error={fieldErrors.gear}>
            {(c) => <TextInput {...c} value={gear} onChange={(e) => setGear(e.target.value)} />}
          </FormField>
          <FormField label="Tune revision" optional error={fieldErrors.tuneRevision}>
            {(c) => (
              <TextInput
                {...c}
                value={tuneRevision}
                onChange={(e) => setTuneRevision(e.target.value)}
              />
            )}
          </FormField>
        </div>
      )}

      {serverError && (
        <Alert tone="error" title="Not saved">
          {serverError.message}
        </Alert>
      )}
      {serverRows.length > 0 && (
        <ErrorTable
          errors={serverRows.flatMap((r) =>
            Object.entries(r.fields).map(([column, message]) => ({ row: r.row, column, message })),
          )}
          total={0}
        />
      )}

      <FormActions
        layout="sticky"
        onCancel={onCancel}
        onSubmit={() => void save()}
        submitDisabled={!ready}
        pending={saving}
        submitIcon={<FileUp aria-hidden className="size-5" />}
        submitLabel={replace ? 'Replace the curve' : 'Save the run'}
      />
    </div>
  );
}
