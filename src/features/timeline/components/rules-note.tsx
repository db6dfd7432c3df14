/** The threat rules in plain words, as the server applies them (see the README). */
export function RulesNote({ bufferDays }: { bufferDays: number }) {
  return (
    <details className="rounded-md border border-rule bg-sheet px-3 py-2 text-[15px] text-ink-2">
      <summary className="min-h-11 cursor-pointer content-center font-semibold text-ink">
        How Headroom judges what threatens the date
      </summary>
      <ul className="flex list-disc flex-col gap-1.5 py-2 pl-5">
        <li>
          The <strong>parts cut-off</strong> is the target date less your buffer ({bufferDays}{' '}
          {bufferDays === 1 ? 'day' : 'days'}). On the cut-off is in time; a day later is late.
        </li>
        <li>
          A part still to buy or on order is late when it is expected after the cut-off, or when its
          expected date has passed and today is already past the cut-off.
        </li>
        <li>
          A part with no expected date threatens the date when the power estimate counts it (it has
          a rating) or an unfinished install step uses it.
        </li>
        <li>
          A part out at a shop is late when it is overdue (past its sent-out date plus the promised
          turnaround) or due back after the cut-off.
        </li>
        <li>
          With a pace set, install jobs are worked in order: a job is behind when its steps left,
          after those of the jobs before it, run past the target date.
        </li>
        <li>A milestone not done is late from the day after its date.</li>
        <li>Days are whole calendar days in the build’s time zone.</li>
      </ul>
    </details>
  );
}
