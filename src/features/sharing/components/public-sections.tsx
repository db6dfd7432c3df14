/** The public page's sections about the build itself: the truck, the estimate, parts, install. */
import type { ReactNode } from 'react';
import { ClipboardList, Gauge, Package, Truck } from 'lucide-react';
import { formatNumber } from '@shared/format';
import type { BuildView } from '@shared/schemas/sharing';
import { Badge } from '@/components/ui/badge';
import { Section } from '@/components/ui/card';
import { StatusChip } from './status-chip';
import {
  dateText,
  engineFacts,
  headroomText,
  powerText,
  readingsText,
  stepStatusLabels,
  torqueSpecText,
  vehicleLine,
} from './view-text';

type View = BuildView;
export const sectionIcon = 'size-5 text-ink-3';
const icon = sectionIcon;

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

export function TruckSection({ summary }: { summary: NonNullable<View['summary']> }) {
  return (
    <Section id="truck" title="Truck" icon={<Truck aria-hidden className={icon} />}>
      <dl>
        <Fact term="Vehicle">{vehicleLine(summary) || 'Not given'}</Fact>
        <Fact term="Engine">
          {summary.engineDescription && <span className="block">{summary.engineDescription}</span>}
          <span className="text-ink-2">{engineFacts(summary)}</span>
        </Fact>
        <Fact term="Transmission">{summary.transmission || 'Not given'}</Fact>
        {summary.stockPowerHp != null && (
          <Fact term="Stock">{powerText(summary.stockPowerHp, summary.stockPowerBasis)}</Fact>
        )}
        <Fact term="Target">
          {powerText(summary.targetPowerHp, summary.targetPowerBasis)}
          {summary.targetTorqueLbft != null &&
            `, ${formatNumber(summary.targetTorqueLbft, 0)} lbf·ft`}
        </Fact>
        {(summary.targetDate || summary.targetEvent) && (
          <Fact term="When">
            {[summary.targetEvent, summary.targetDate && dateText(summary.targetDate)]
              .filter(Boolean)
              .join(', ')}
          </Fact>
        )}
      </dl>
    </Section>
  );
}

export function EstimateSection({ estimate }: { estimate: NonNullable<View['estimate']> }) {
  const w = estimate.weakestLink;
  return (
    <Section id="estimate" title="Power estimate" icon={<Gauge aria-hidden className={icon} />}>
      {w ? (
        <div className="flex flex-col gap-3">
          <div>
            <p className="text-sm font-semibold tracking-wide text-muted uppercase">Weakest link</p>
            <p className="text-xl font-bold break-words">{w.name}</p>
            <p className="flex flex-wrap items-center gap-2 text-ink-2">
              {w.categoryLabel}
              <Badge tone={w.status}>{headroomText(w.headroomPct)} headroom</Badge>
            </p>
          </div>
          {estimate.supported && (
            <p>
              The build as planned supports about{' '}
              <strong>{powerText(estimate.supported.crankHp, 'crank')}</strong> (
              {powerText(estimate.supported.wheelHp, 'wheel')}).
            </p>
          )}
          {estimate.warnings.length > 0 && (
            <ul className="flex flex-col gap-1.5 text-[15px] text-ink-2">
              {estimate.warnings.map((warning, i) => (
                <li key={i} className="border-l-[3px] border-tight pl-2.5">
                  {warning.message}
                </li>
              ))}
            </ul>
          )}
          <p className="text-sm text-muted">
            Estimates are estimates: ratings are the makers&rsquo; claims.
          </p>
        </div>
      ) : (
        <p className="text-muted">No part has a rating yet, so there is nothing to weigh.</p>
      )}
    </Section>
  );
}

export function PartsSection({ parts }: { parts: NonNullable<View['parts']> }) {
  return (
    <Section id="parts" title="Parts" icon={<Package aria-hidden className={icon} />}>
      {parts.total === 0 ? (
        <p className="text-muted">No parts listed yet.</p>
      ) : (
        <div className="flex flex-col gap-5">
          {parts.categories.map((c) => (
            <div key={c.category}>
              <h3 className="mb-1 font-bold text-ink">{c.label}</h3>
              <ul className="divide-y divide-rule border-y border-rule">
                {c.parts.map((p, i) => (
                  <li
                    key={i}
                    className="flex flex-wrap items-start justify-between gap-x-3 gap-y-1 py-2"
                  >
                    <div className="min-w-0 flex-1">
                      <p className="font-semibold break-words">
                        {p.quantity > 1 && <span className="text-ink-2">{p.quantity} × </span>}
                        {p.name}
                      </p>
                      {p.rating && (
                        <p className="text-[15px] text-ink-2">
                          Rated {formatNumber(p.rating.value, 1)} {p.rating.unitLabel}
                          {p.rating.for && ` (${p.rating.for})`}
                          {p.headroom && (
                            <>
                              {' · '}
                              <span
                                className={
                                  p.headroom.status === 'over'
                                    ? 'font-semibold text-over'
                                    : undefined
                                }
                              >
                                {headroomText(p.headroom.pct)} headroom
                              </span>
                            </>
                          )}
                        </p>
                      )}
                    </div>
                    <StatusChip status={p.status} label={p.statusLabel} />
                  </li>
                ))}
              </ul>
            </div>
          ))}
        </div>
      )}
    </Section>
  );
}

export function InstallSection({ install }: { install: NonNullable<View['install']> }) {
  const t = install.totals;
  return (
    <Section id="install" title="Install" icon={<ClipboardList aria-hidden className={icon} />}>
      {install.jobs.length === 0 ? (
        <p className="text-muted">No install work logged yet.</p>
      ) : (
        <div className="flex flex-col gap-4">
          <p className="text-ink-2">
            {t.signedOff} of {t.steps} steps signed off
            {t.positionsTotal > 0 &&
              ` · ${t.positionsRecorded} of ${t.positionsTotal} fasteners torqued, ${t.inSpec} in spec`}
            {t.outOfSpec > 0 && `, ${t.outOfSpec} out of spec`}.
          </p>
          {install.jobs.map((job, j) => (
            <div key={j}>
              <h3 className="mb-1 font-bold">{job.title}</h3>
              <ol className="divide-y divide-rule border-y border-rule">
                {job.steps.map((s, i) => (
                  <li key={i} className="py-2">
                    <div className="flex flex-wrap items-start justify-between gap-2">
                      <p className="min-w-0 flex-1 font-semibold break-words">{s.title}</p>
                      <Badge
                        tone={
                          s.status === 'signed-off'
                            ? 'ok'
                            : s.status === 'under-way'
                              ? 'tight'
                              : 'neutral'
                        }
                      >
                        {stepStatusLabels[s.status]}
                      </Badge>
                    </div>
                    {s.signOff && (
                      <p className="text-sm text-ink-2">
                        Signed off {dateText(s.signOff.on)}
                        {s.signOff.by && ` by ${s.signOff.by}`}
                        {s.signOff.override && ' (by the owner, over an open item)'}
                      </p>
                    )}
                    {s.fasteners.map((f, k) => (
                      <p key={k} className="text-sm text-ink-2">
                        {f.name}: {torqueSpecText(f)} — {readingsText(f)}
                      </p>
                    ))}
                  </li>
                ))}
              </ol>
            </div>
          ))}
        </div>
      )}
    </Section>
  );
}
