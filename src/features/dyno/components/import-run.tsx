import { useId, useRef, useState } from 'react';
import { FileUp } from 'lucide-react';
import { MAX_CURVE_ROWS, type DynoRun, type RunStatus } from '@shared/schemas/dyno';
import { formatNumber } from '@shared/format';
import { FormActions } from '@/components/ui/form-actions';
import { Alert } from '@/components/ui/alert';
import { Modal } from '@/components/ui/modal';
import { Spinner } from '@/components/ui/spinner';
import { useImportDynoRun } from '../api/import-dyno-run';
import { useReplaceDynoCurve } from '../api/replace-dyno-curve';
import { UploadError } from '@/lib/upload';
import { RunBasicsFields } from './run-basics-fields';
import { RowProblemsTable } from '@/components/ui/row-problems';
import { Preview, readCsv, type Read } from './curve-preview';

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
  const [basics, setBasics] = useState<{
    status: RunStatus;
    abortReason: string;
    gear: string;
    tuneRevision: string;
  }>({ status: 'complete', abortReason: '', gear: '', tuneRevision: '' });
  const { status, abortReason, gear, tuneRevision } = basics;
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
          <RowProblemsTable problems={read.result.errors} total={read.result.errorCount} />
        </>
      )}
      {ready && ready.result.ok && <Preview result={ready.result} />}

      {!replace && (
        <div className="grid grid-cols-1 gap-4 rounded-lg border border-rule bg-sheet p-4 sm:grid-cols-2">
          <RunBasicsFields
            status={basics.status}
            errors={fieldErrors}
            bind={(name) => ({
              value: basics[name],
              onChange: (e) => setBasics((v) => ({ ...v, [name]: e.target.value })),
            })}
          />
        </div>
      )}

      {serverError && (
        <Alert tone="error" title="Not saved">
          {serverError.message}
        </Alert>
      )}
      {serverRows.length > 0 && (
        <RowProblemsTable
          problems={serverRows.flatMap((r) =>
            Object.entries(r.fields).map(([column, message]) => ({ row: r.row, column, message })),
          )}
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
