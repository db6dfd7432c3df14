import { useId, useState } from 'react';
import { FileUp } from 'lucide-react';
import { Alert } from '@/components/ui/alert';
import { cn } from '@/components/ui/cn';
import { Spinner } from '@/components/ui/spinner';
import { UploadError } from '@/lib/upload';
import { useImportBenchCsv } from '../api/import-bench-csv';
import type { BenchImportRowError } from '@shared/schemas/bench';

/**
 * Replaces a saved sheet's values from a CSV, as a bench's own software exports it: one row
 * per injector, one column per test point headed by its label. The server checks every cell
 * and saves all or none; refused cells are listed by row and column.
 */
export function ReplaceFromCsv({ buildId, sheetId }: { buildId: string; sheetId: string }) {
  const importCsv = useImportBenchCsv();
  const inputId = useId();
  const [message, setMessage] = useState<{ tone: 'ok' | 'error'; text: string } | null>(null);
  const [rows, setRows] = useState<BenchImportRowError[]>([]);

  async function send(file: File) {
    setMessage(null);
    setRows([]);
    try {
      const answer = await importCsv.mutateAsync({ buildId, sheetId, file });
      const n = answer.positions.length;
      setMessage({
        tone: 'ok',
        text: `Values replaced from “${file.name}”: ${n} injector${n === 1 ? '' : 's'}.`,
      });
    } catch (e) {
      setMessage({
        tone: 'error',
        text: e instanceof Error ? e.message : 'Could not read the file.',
      });
      if (e instanceof UploadError) {
        setRows(e.rows);
        if (e.fields?.file) setMessage({ tone: 'error', text: `${e.message} ${e.fields.file}.` });
      }
    }
  }

  return (
    <div className="flex flex-col gap-2">
      <input
        id={inputId}
        type="file"
        accept=".csv,text/csv"
        className="peer sr-only"
        disabled={importCsv.isPending}
        onChange={(e) => {
          const file = e.target.files?.[0];
          e.target.value = '';
          if (file) void send(file);
        }}
      />
      <label
        htmlFor={inputId}
        className={cn(
          'inline-flex min-h-11 cursor-pointer items-center gap-2 self-start rounded-md border border-rule-strong bg-sheet px-4 text-base font-semibold text-ink shadow-sm hover:border-ink-3',
          'peer-focus-visible:outline-3 peer-focus-visible:outline-offset-2 peer-focus-visible:outline-accent-500',
        )}
      >
        {importCsv.isPending ? (
          <Spinner className="size-4" />
        ) : (
          <FileUp aria-hidden className="size-4" />
        )}
        Replace values from a CSV
      </label>
      {message && <Alert tone={message.tone}>{message.text}</Alert>}
      {rows.length > 0 && (
        <ul aria-label="Cells to fix" className="flex flex-col gap-1 text-[15px]">
          {rows.flatMap((r) =>
            Object.entries(r.fields).map(([column, text]) => (
              <li key={`${r.row}-${column}`}>
                <span className="font-semibold">
                  Row {r.row}, {column}:
                </span>{' '}
                {text}
              </li>
            )),
          )}
        </ul>
      )}
    </div>
  );
}
