import type { ReactNode } from 'react';
import { Link } from 'react-router-dom';
import { Flag, Gauge, Truck, Wallet } from 'lucide-react';
import { powerBasisLabels } from '@shared/builds/vocabulary';
import type { Build } from '@shared/schemas/builds';
import { can } from '@shared/permissions';
import { formatIsoDate, formatMoney, formatNumber } from '@shared/format';
import { Section } from '@/components/ui/card';
import { paths } from '@/config/paths';
import { engineFacts, powerText, vehicleLine } from './build-text';

function Fact({ term, children }: { term: string; children: ReactNode }) {
  return (
    <div className="flex flex-col gap-0.5 border-b border-rule py-2.5 last:border-b-0 sm:flex-row sm:gap-4">
      <dt className="shrink-0 text-sm font-semibold tracking-wide text-muted uppercase sm:w-36 sm:pt-0.5">
        {term}
      </dt>
      <dd className="min-w-0 break-words text-ink">{children}</dd>
    </div>
  );
}

const notGiven = <span className="text-muted">Not recorded</span>;

export function TruckSection({ build }: { build: Build }) {
  const vehicle = vehicleLine(build);
  return (
    <Section id="truck" title="Truck" icon={<Truck aria-hidden className="size-5 text-ink-3" />}>
      <dl>
        <Fact term="Vehicle">{vehicle || notGiven}</Fact>
        <Fact term="Engine">
          {build.engineDescription && <span className="block">{build.engineDescription}</span>}
          <span className={build.engineDescription ? 'text-ink-2' : undefined}>
            {engineFacts(build)}
          </span>
        </Fact>
        <Fact term="Transmission">{build.transmission || notGiven}</Fact>
      </dl>
    </Section>
  );
}

export function TargetSection({ build }: { build: Build }) {
  const gain =
    build.stockPowerHp != null && build.stockPowerBasis === build.targetPowerBasis
      ? build.targetPowerHp - build.stockPowerHp
      : null;
  return (
    <Section
      id="target"
      title="Target"
      icon={<Gauge aria-hidden className="size-5 text-accent-600" />}
    >
      <div className="flex flex-wrap items-end gap-x-6 gap-y-3">
        <div>
          <p className="text-sm font-semibold tracking-wide text-muted uppercase">Target power</p>
          <p className="text-4xl leading-none font-bold tabular-nums text-ink">
            {formatNumber(build.targetPowerHp, 1)}
            <span className="ml-1.5 text-xl font-semibold text-ink-2">
              {powerBasisLabels[build.targetPowerBasis]}
            </span>
          </p>
        </div>
        {build.stockPowerHp != null && (
          <div className="text-ink-2">
            <p className="text-sm font-semibold tracking-wide text-muted uppercase">From stock</p>
            <p className="text-lg tabular-nums">
              {powerText(build.stockPowerHp, build.stockPowerBasis)}
              {gain !== null && gain > 0 && (
                <span className="ml-2 font-semibold text-ok">+{formatNumber(gain, 1)} hp</span>
              )}
            </p>
          </div>
        )}
      </div>
      <dl className="mt-4">
        <Fact term="Target torque">
          {build.targetTorqueLbft != null
            ? `${formatNumber(build.targetTorqueLbft, 1)} lbf·ft`
            : notGiven}
        </Fact>
        <Fact term="Event">
          {build.targetEvent ? (
            <span className="inline-flex items-center gap-1.5">
              <Flag aria-hidden className="size-4 text-ink-3" />
              {build.targetEvent}
            </span>
          ) : (
            notGiven
          )}
        </Fact>
        <Fact term="Target date">
          {build.targetDate ? (
            // The countdown is the Timeline card's, counted on the server in the build's zone.
            <time dateTime={build.targetDate}>{formatIsoDate(build.targetDate)}</time>
          ) : (
            <span className="text-muted">No date set</span>
          )}
        </Fact>
      </dl>
    </Section>
  );
}

/**
 * Money, for those allowed to see it. Other roles get no section at all — not a "$0" and
 * not a "hidden" placeholder — because the API leaves budgetCents out for them.
 */
export function BudgetSection({ build }: { build: Build }) {
  if (!can(build.myRole, 'money:read')) return null;
  return (
    <Section id="budget" title="Budget" icon={<Wallet aria-hidden className="size-5 text-ink-3" />}>
      {typeof build.budgetCents === 'number' && build.budgetCents > 0 ? (
        <p className="text-3xl font-bold tabular-nums">
          {formatMoney(build.budgetCents, build.currency, { display: 'narrowSymbol' })}
          <span className="ml-2 text-base font-semibold text-muted">{build.currency}</span>
        </p>
      ) : (
        <p className="text-muted">
          No budget set.{' '}
          {can(build.myRole, 'build:update') && (
            <Link
              to={paths.builds.edit.getHref(build.id)}
              className="font-semibold text-accent-700 underline"
            >
              Set one
            </Link>
          )}
        </p>
      )}
      <p className="mt-2 text-sm text-muted">Only owners see money.</p>
    </Section>
  );
}
