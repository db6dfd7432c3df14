import type { ReactNode } from 'react';
import { Activity, Camera, ClipboardList, Droplets, Gauge, Package, Truck, Users } from 'lucide-react';
import { formatNumber } from '../../../../shared/format';
import type { BuildView } from '../../../../shared/schemas/sharing';
import { Badge } from '../../../components/ui/badge';
import { Section } from '../../../components/ui/card';
import { StatusChip } from './status-chip';
import {
  dateText,
  dynoPower,
  dynoTorque,
  engineFacts,
  headroomText,
  percent,
  powerText,
  readingsText,
  roleNames,
  standardLabels,
  stepStatusLabels,
  torqueSpecText,
  vehicleLine,
} from './view-text';

type View = BuildView;
const icon = 'size-5 text-ink-3';

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
          {summary.engineDescription && (
            <span className="block">{summary.engineDescription}</span>
          )}
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
            <p className="text-sm font-semibold tracking-wide text-muted uppercase">
              Weakest link
            </p>
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
                  <li key={i} className="flex flex-wrap items-start justify-between gap-x-3 gap-y-1 py-2">
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
                              <span className={p.headroom.status === 'over' ? 'font-semibold text-over' : undefined}>
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
                      <Badge tone={s.status === 'signed-off' ? 'ok' : s.status === 'under-way' ? 'tight' : 'neutral'}>
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

export function BenchSection({ bench }: { bench: NonNullable<View['bench']> }) {
  return (
    <Section id="bench" title="Injector bench" icon={<Droplets aria-hidden className={icon} />}>
      {bench.sheets.length === 0 ? (
        <p className="text-muted">No bench sheets yet.</p>
      ) : (
        <ul className="divide-y divide-rule border-y border-rule">
          {bench.sheets.map((s, i) => (
            <li key={i} className="py-2">
              <p className="font-semibold break-words">
                {s.partName} <span className="font-normal text-ink-2">· {s.occasion}</span>
              </p>
              <p className="text-sm text-muted">Tested {dateText(s.testedOn)}</p>
              <p className="text-[15px] text-ink-2">{s.verdict}</p>
            </li>
          ))}
        </ul>
      )}
    </Section>
  );
}

export function DynoSection({ dyno }: { dyno: NonNullable<View['dyno']> }) {
  return (
    <Section id="dyno" title="Dyno" icon={<Activity aria-hidden className={icon} />}>
      {dyno.sessions.length === 0 ? (
        <p className="text-muted">No dyno days yet.</p>
      ) : (
        <div className="flex flex-col gap-3">
          {dyno.vsTarget && (
            <p>
              Best so far: <strong>{powerText(dyno.vsTarget.achievedHp, dyno.vsTarget.basis)}</strong>,{' '}
              {dyno.vsTarget.reached
                ? 'the target is reached'
                : `${Math.min(99, Math.floor(dyno.vsTarget.progressPct))} % of the target`}
              .
            </p>
          )}
          <ul className="divide-y divide-rule border-y border-rule">
            {dyno.sessions.map((s, i) => (
              <li key={i} className="py-2">
                <p className="font-semibold">
                  {dateText(s.date)}{' '}
                  <span className="font-normal text-ink-2">
                    · {s.dynoKind === 'chassis' ? 'chassis dyno' : 'engine dyno'} · {s.runCount}{' '}
                    {s.runCount === 1 ? 'pull' : 'pulls'}
                  </span>
                </p>
                {s.best ? (
                  <p className="text-[15px] text-ink-2">
                    {dynoPower(s.best)}; {dynoTorque(s.best)}
                  </p>
                ) : (
                  <p className="text-sm text-muted">No complete pull.</p>
                )}
              </li>
            ))}
          </ul>
          <p className="text-sm text-muted">
            Corrected to {standardLabels[dyno.standard] ?? dyno.standard}.
          </p>
        </div>
      )}
    </Section>
  );
}

export function PhotosSection({ photos }: { photos: NonNullable<View['photos']> }) {
  return (
    <Section id="photos" title="Photos" icon={<Camera aria-hidden className={icon} />}>
      {photos.length === 0 ? (
        <p className="text-muted">No photos shared yet.</p>
      ) : (
        <ul className="grid grid-cols-2 gap-3 sm:grid-cols-3">
          {photos.map((p, i) => (
            <li key={p.id} className="min-w-0">
              <a
                href={p.webUrl}
                className="block overflow-hidden rounded-md border border-rule bg-ink/5"
                aria-label={`Open ${p.caption ? `“${p.caption}”` : `photo ${i + 1}`} full size`}
              >
                <img
                  src={p.thumbUrl}
                  alt={p.caption || `Photo ${i + 1}`}
                  loading="lazy"
                  className="aspect-[4/3] w-full object-cover"
                />
              </a>
              {p.caption && <p className="mt-1 text-[15px] break-words">{p.caption}</p>}
            </li>
          ))}
        </ul>
      )}
    </Section>
  );
}

export function CrewSection({ crew }: { crew: NonNullable<View['crew']> }) {
  return (
    <Section id="crew" title="Crew" icon={<Users aria-hidden className={icon} />}>
      <ul className="flex flex-wrap gap-2">
        {crew.map((m, i) => (
          <li key={i} className="rounded-md border border-rule px-2.5 py-1">
            <span className="font-semibold">{m.name}</span>{' '}
            <span className="text-ink-2">· {roleNames[m.role] ?? m.role}</span>
          </li>
        ))}
      </ul>
    </Section>
  );
}

/** The numbers a visitor wants first, as short cards. */
export function AtAGlance({ view }: { view: View }) {
  const cards: { label: string; value: string; note?: string }[] = [];
  if (view.summary) {
    cards.push({
      label: 'Target',
      value: powerText(view.summary.targetPowerHp, view.summary.targetPowerBasis),
      note: view.summary.targetDate ? `by ${dateText(view.summary.targetDate)}` : undefined,
    });
  }
  if (view.dyno?.vsTarget) {
    cards.push({
      label: 'Best on the dyno',
      value: powerText(view.dyno.vsTarget.achievedHp, view.dyno.vsTarget.basis),
      note: view.dyno.vsTarget.reached
        ? 'Target reached'
        : `${Math.min(99, Math.floor(view.dyno.vsTarget.progressPct))} % of the target`,
    });
  }
  if (view.estimate?.supported) {
    cards.push({
      label: 'Parts support',
      value: powerText(view.estimate.supported.crankHp, 'crank'),
      note: view.estimate.weakestLink ? `limited by ${view.estimate.weakestLink.name}` : undefined,
    });
  }
  if (view.parts && view.parts.total > 0) {
    const on = view.parts.byStatus.installed ?? 0;
    cards.push({
      label: 'On the truck',
      value: `${on} of ${view.parts.total} parts`,
      note: `${percent(on, view.parts.total)} %`,
    });
  }
  if (view.install && view.install.totals.steps > 0) {
    const t = view.install.totals;
    cards.push({
      label: 'Install',
      value: `${t.signedOff} of ${t.steps} steps`,
      note: 'signed off',
    });
  }
  if (cards.length === 0) return null;
  return (
    <ul aria-label="At a glance" className="grid grid-cols-2 gap-3 lg:grid-cols-5">
      {cards.map((c) => (
        <li key={c.label} className="rounded-lg border border-rule bg-sheet px-3 py-2.5">
          <p className="text-sm font-semibold tracking-wide text-muted uppercase">{c.label}</p>
          <p className="text-lg leading-snug font-bold break-words">{c.value}</p>
          {c.note && <p className="text-sm break-words text-ink-2">{c.note}</p>}
        </li>
      ))}
    </ul>
  );
}
