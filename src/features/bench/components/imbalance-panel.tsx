import type { BenchPowerTarget, ImbalanceCost } from '@shared/schemas/bench';
import { hpWords, pctWords } from '@shared/bench';
import { BenchWorking } from './bench-working';

/**
 * What the set's imbalance costs at the build's target, by a rule of thumb, with the
 * arithmetic one click away.
 */
export function ImbalancePanel({
  imbalance,
  target,
}: {
  imbalance: ImbalanceCost;
  target: BenchPowerTarget;
}) {
  if (!imbalance.available) {
    return <p className="text-ink-2">Not worked out: {imbalance.reason}.</p>;
  }
  return (
    <div className="flex flex-col gap-3">
      <div className="flex flex-wrap items-baseline gap-x-6 gap-y-2">
        <p>
          <span className="block text-xs font-semibold tracking-wide text-muted uppercase">
            Given up at the target
          </span>
          <span className="text-2xl font-bold tabular-nums" data-testid="imbalance-hp">
            about {hpWords(imbalance.power.value)}
          </span>{' '}
          <span className="text-muted">
            of {target.powerHp} {target.basis} hp
          </span>
        </p>
        <p>
          <span className="block text-xs font-semibold tracking-wide text-muted uppercase">
            Share of peak power
          </span>
          <span className="text-2xl font-bold tabular-nums">
            {pctWords(imbalance.sharePct.value)}
          </span>
        </p>
      </div>
      <p className="text-ink-2">{imbalance.summary}.</p>
      <BenchWorking figures={[imbalance.sharePct, imbalance.power]} label="imbalance cost" />
    </div>
  );
}
