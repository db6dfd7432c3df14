import { completeCurve, parseCurveCsv, runPeaks, type CurveCsvResult } from '@shared/dyno';
import {
  MAX_CURVE_CSV_BYTES,
  boostUnitLabels,
  defaultRunUnits,
  dynoTemperatureUnitLabels,
  mixtureKindLabels,
  type RunUnits,
} from '@shared/schemas/dyno';
import { formatNumber } from '@shared/format';
import { unitLabels } from '@shared/units/labels';
import { Alert } from '@/components/ui/alert';
import { powerText, rpmText, torqueText } from '../format';

/* A curve CSV read in the browser as the server will read it: its errors per row, or a preview. */

const previewRows = 12;

export type Read =
  | { kind: 'reading' }
  | { kind: 'file'; message: string }
  | { kind: 'parsed'; file: File; result: CurveCsvResult };

/** Reads a chosen file as the server will: at most 2 MB, UTF-8, then the shared parser. */
export async function readCsv(file: File): Promise<Read> {
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

/** What the file holds, before anything is saved: units, rows, peaks and the first rows. */
export function Preview({ result }: { result: Extract<CurveCsvResult, { ok: true }> }) {
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
          In {unitLabels[units.powerUnit]} and {unitLabels[units.torqueUnit]}, as in the file. *
          worked out from the other by P = 2πnT/60.
        </p>
      </div>
    </div>
  );
}
