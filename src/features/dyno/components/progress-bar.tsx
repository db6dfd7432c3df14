/** A bar from 0 to the target; the fill stops at 100 %, the words say the rest. */
export function ProgressBar({ pct, label }: { pct: number; label: string }) {
  const shown = Math.max(0, Math.min(100, pct));
  return (
    <div
      role="progressbar"
      aria-label={label}
      aria-valuemin={0}
      aria-valuemax={100}
      aria-valuenow={Math.round(shown)}
      className="h-3 w-full overflow-hidden rounded-full bg-ink/[0.08]"
    >
      <div
        className={`h-full rounded-full ${pct >= 100 ? 'bg-ok' : 'bg-accent-500'}`}
        style={{ width: `${shown}%` }}
      />
    </div>
  );
}
