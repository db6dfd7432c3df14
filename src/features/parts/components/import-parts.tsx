import { useId, useRef, useState } from 'react';
import { FileUp, Upload } from 'lucide-react';
import { formatMoney } from '@shared/format';
import { csvColumnOfField } from '@shared/ledger/csv';
import { partCategoryLabels, partStatusLabels, type CreatePartInput } from '@shared/schemas/parts';
import { RowProblemsTable } from '@/components/ui/row-problems';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { Spinner } from '@/components/ui/spinner';
import { getPartsCsvHref } from '../api/export-parts-csv';
import { UploadError, type RowError } from '@/lib/upload';
import { useImportParts } from '../api/import-parts';
import { Modal } from '@/components/ui/modal';

const previewLimit = 200;

type Checked =
  | { kind: 'ok'; rows: CreatePartInput[] }
  | { kind: 'rows'; message: string; rows: RowError[] }
  | { kind: 'file'; message: string };

/**
 * CSV import in two steps: the file is checked on the server without saving (dryRun), the
 * rows and any errors are shown, and only "Import N parts" saves them, all or none.
 */
export function ImportPartsDialog({
  open,
  buildId,
  currency,
  onClose,
  onImported,
}: {
  open: boolean;
  buildId: string;
  currency: string;
  onClose: () => void;
  onImported: (count: number) => void;
}) {
  const importParts = useImportParts();
  const [file, setFile] = useState<File | null>(null);
  const [checked, setChecked] = useState<Checked | null>(null);
  const inputRef = useRef<HTMLInputElement>(null);
  const inputId = useId();

  function reset() {
    setFile(null);
    setChecked(null);
    importParts.reset();
    if (inputRef.current) inputRef.current.value = '';
  }

  function close() {
    reset();
    onClose();
  }

  function describe(error: unknown): Checked {
    if (error instanceof UploadError && error.code === 'invalid_rows') {
      return { kind: 'rows', message: error.message, rows: error.rows };
    }
    return {
      kind: 'file',
      message: error instanceof Error ? error.message : 'The file could not be checked.',
    };
  }

  async function check(next: File) {
    setFile(next);
    setChecked(null);
    try {
      const result = await importParts.mutateAsync({ buildId, file: next, dryRun: true });
      setChecked({ kind: 'ok', rows: result.rows });
    } catch (error) {
      setChecked(describe(error));
    }
  }

  async function save() {
    if (!file) return;
    try {
      const result = await importParts.mutateAsync({ buildId, file, dryRun: false });
      reset();
      onImported(result.saved);
    } catch (error) {
      setChecked(describe(error));
    }
  }

  const checking = importParts.isPending && importParts.variables?.dryRun;
  const saving = importParts.isPending && !importParts.variables?.dryRun;

  return (
    <Modal
      open={open}
      onClose={close}
      busy={saving}
      wide
      title="Import parts from a CSV file"
      description="Nothing is saved until you have seen the rows and chosen to import them."
    >
      <div className="flex flex-col gap-4">
        <div className="flex flex-col gap-2 rounded-lg border border-rule bg-sheet p-4">
          <label htmlFor={inputId} className="font-semibold">
            CSV file
          </label>
          <input
            ref={inputRef}
            id={inputId}
            type="file"
            accept=".csv,text/csv"
            disabled={importParts.isPending}
            onChange={(e) => {
              const next = e.target.files?.[0];
              if (next) void check(next);
            }}
            className="block min-h-11 w-full text-[15px] file:mr-3 file:min-h-11 file:cursor-pointer file:rounded-md file:border file:border-rule-strong file:bg-paper file:px-4 file:font-semibold file:text-ink"
          />
          <p className="text-sm text-muted">
            UTF-8, at most 2 MB. Columns named as in the{' '}
            <a
              href={getPartsCsvHref(buildId)}
              download
              className="font-semibold text-accent-700 underline"
            >
              exported ledger
            </a>
            ; only <code>category</code> and <code>name</code> are required. Money as plain amounts
            (1234.56), dates as 2027-05-30.
          </p>
        </div>

        {checking && (
          <p role="status" className="flex items-center gap-2 text-muted">
            <Spinner className="size-5" /> Checking {file?.name}…
          </p>
        )}

        {checked?.kind === 'file' && (
          <Alert tone="error" title="This file cannot be imported">
            {checked.message}
          </Alert>
        )}

        {checked?.kind === 'rows' && (
          <>
            <Alert tone="error" title="Some rows need fixing">
              {checked.message}. Fix them in the file and choose it again.
            </Alert>
            <RowProblemsTable
              caption="Rows with errors"
              problems={checked.rows.flatMap((r) =>
                Object.entries(r.fields).map(([field, message], i) => ({
                  row: i === 0 ? r.row : '',
                  column: csvColumnOfField(field),
                  message,
                })),
              )}
            />
          </>
        )}

        {checked?.kind === 'ok' && (
          <>
            <Alert
              tone="ok"
              title={
                checked.rows.length === 1
                  ? '1 row is ready'
                  : `${checked.rows.length} rows are ready`
              }
            >
              Every row checked out. Nothing is saved yet.
            </Alert>
            <div className="max-h-[50vh] overflow-auto rounded-lg border border-rule bg-sheet">
              <table className="w-full border-collapse text-left text-[15px]">
                <caption className="sr-only">Parts to import</caption>
                <thead className="sticky top-0 bg-paper">
                  <tr className="border-b border-rule-strong text-sm">
                    <th scope="col" className="px-3 py-2">
                      Row
                    </th>
                    <th scope="col" className="px-3 py-2">
                      Part
                    </th>
                    <th scope="col" className="px-3 py-2">
                      Category
                    </th>
                    <th scope="col" className="px-3 py-2">
                      Status
                    </th>
                    <th scope="col" className="px-3 py-2 text-right">
                      Qty
                    </th>
                    <th scope="col" className="px-3 py-2 text-right">
                      Unit price
                    </th>
                  </tr>
                </thead>
                <tbody>
                  {checked.rows.slice(0, previewLimit).map((p, i) => (
                    <tr key={i} className="border-b border-rule last:border-b-0">
                      <td className="px-3 py-2 text-muted tabular-nums">{i + 2}</td>
                      <th scope="row" className="px-3 py-2 font-semibold">
                        {p.name}
                      </th>
                      <td className="px-3 py-2">{partCategoryLabels[p.category]}</td>
                      <td className="px-3 py-2">{partStatusLabels[p.status ?? 'planned']}</td>
                      <td className="px-3 py-2 text-right tabular-nums">{p.quantity ?? 1}</td>
                      <td className="px-3 py-2 text-right tabular-nums">
                        {p.unitPriceCents != null ? formatMoney(p.unitPriceCents, currency) : '—'}
                      </td>
                    </tr>
                  ))}
                </tbody>
              </table>
              {checked.rows.length > previewLimit && (
                <p className="px-3 py-2 text-sm text-muted">
                  The first {previewLimit} of {checked.rows.length} rows are shown.
                </p>
              )}
            </div>
          </>
        )}

        <div className="sticky bottom-0 -mx-4 flex flex-col-reverse gap-2 border-t border-rule bg-paper px-4 py-3 sm:-mx-5 sm:flex-row sm:justify-end sm:px-5">
          <Button variant="secondary" onClick={close} disabled={saving}>
            Cancel
          </Button>
          {checked && checked.kind !== 'ok' && (
            <Button
              variant="secondary"
              icon={<FileUp aria-hidden className="size-4" />}
              onClick={() => inputRef.current?.click()}
            >
              Choose another file
            </Button>
          )}
          {checked?.kind === 'ok' && (
            <Button
              pending={saving}
              icon={<Upload aria-hidden className="size-4" />}
              onClick={() => void save()}
            >
              Import {checked.rows.length} {checked.rows.length === 1 ? 'part' : 'parts'}
            </Button>
          )}
        </div>
      </div>
    </Modal>
  );
}
