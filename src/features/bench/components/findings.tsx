import { ChevronRight, CircleCheck, TriangleAlert } from 'lucide-react';
import {
  MAKER_RETURN_LIMIT_RULE,
  TOLERANCE_EDGE_RULE,
  WORN_INJECTOR_RULE,
  capitalise,
} from '@shared/bench';
import type { BenchSheetResult } from '@shared/schemas/bench';

/** The set verdict in words, each finding on its own line, and how the sheet was judged. */
export function Findings({ result }: { result: BenchSheetResult }) {
  const problems = result.findings.filter((f) => f.kind !== 'not-measured');
  const notMeasured = result.findings.filter((f) => f.kind === 'not-measured');
  return (
    <div className="flex flex-col gap-3">
      {problems.length > 0 ? (
        <ul aria-label="Findings" className="flex flex-col gap-1.5">
          {problems.map((f, i) => (
            <li key={i} className="flex gap-2 text-[17px] leading-snug">
              <TriangleAlert aria-hidden className="mt-0.5 size-5 shrink-0 text-over" />
              <span>{capitalise(f.text)}</span>
            </li>
          ))}
        </ul>
      ) : (
        <p className="flex gap-2 text-[17px] leading-snug">
          {result.status === 'in-tolerance' && (
            <CircleCheck aria-hidden className="mt-0.5 size-5 shrink-0 text-ok" />
          )}
          <span>{result.verdict}</span>
        </p>
      )}
      {notMeasured.length > 0 && (
        <ul className="text-[15px] text-muted">
          {notMeasured.map((f, i) => (
            <li key={i}>{capitalise(f.text)}</li>
          ))}
        </ul>
      )}
      <details className="group text-[15px]">
        <summary className="inline-flex min-h-11 cursor-pointer list-none items-center gap-1 rounded font-semibold text-accent-700 hover:underline [&::-webkit-details-marker]:hidden">
          <ChevronRight aria-hidden className="size-4 transition-transform group-open:rotate-90" />
          Each point, and how the sheet is judged
        </summary>
        <div className="mt-1 flex flex-col gap-3 rounded-md border border-rule bg-paper/60 px-3 py-3">
          <ul className="flex flex-col gap-1">
            {result.points.map((p) => (
              <li key={p.index}>
                <span className="font-semibold">{p.label}:</span> {p.summary}.
              </li>
            ))}
          </ul>
          <ul className="flex list-disc flex-col gap-1 pl-5 text-ink-2">
            <li>
              Every point but return flow: each injector against the set’s mean ± the point’s
              tolerance, and against the maker’s figure where the sheet gives one.
            </li>
            <li>{WORN_INJECTOR_RULE}</li>
            <li>{MAKER_RETURN_LIMIT_RULE}</li>
            <li>{TOLERANCE_EDGE_RULE} A value not measured is never counted as zero.</li>
          </ul>
        </div>
      </details>
    </div>
  );
}
