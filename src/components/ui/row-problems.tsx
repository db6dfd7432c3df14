/** One problem a file's row has: its row number (or null for the header), column and why. */
export type RowProblem = { row: number | string | null; column?: string | null; message: string };

/**
 * The rows of an imported file that need fixing, with why, per column: one table for every
 * import (parts CSV, dyno curve), so they read alike. `total` above the listed count says
 * only the first problems are shown.
 */
export function RowProblemsTable({
  problems,
  total = problems.length,
  caption = 'Rows that need fixing',
}: {
  problems: RowProblem[];
  total?: number;
  caption?: string;
}) {
  return (
    <div className="max-h-[40vh] overflow-auto rounded-lg border border-rule bg-sheet">
      <table className="w-full border-collapse text-left text-[15px]">
        <caption className="sr-only">{caption}</caption>
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
          {problems.map((p, i) => (
            <tr key={i} className="border-b border-rule last:border-b-0">
              <td className="px-3 py-2 align-top font-semibold tabular-nums">
                {p.row ?? 'Header'}
              </td>
              <td className="px-3 py-2 align-top">{p.column ? <code>{p.column}</code> : '—'}</td>
              <td className="px-3 py-2 align-top [overflow-wrap:anywhere] text-over">
                {p.message}
              </td>
            </tr>
          ))}
        </tbody>
      </table>
      {total > problems.length && (
        <p className="px-3 py-2 text-sm text-muted">
          The first {problems.length} of {total} problems are listed.
        </p>
      )}
    </div>
  );
}
