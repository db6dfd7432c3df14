import type { ReactNode } from 'react';
import { formatMoney, formatNumber } from '@shared/format';
import type { BuildView } from '@shared/schemas/sharing';
import { SheetLists } from './build-sheet-lists';
import {
  dateText,
  dynoPower,
  dynoTorque,
  engineFacts,
  headroomText,
  percent,
  powerText,
  standardLabels,
  vehicleLine,
} from './view-text';

/** One line of the summary: a term and what it says. */
function Line({ term, children }: { term: string; children: ReactNode }) {
  return (
    <div className="break-inside-avoid border-b border-rule py-1.5 sm:grid sm:grid-cols-[11rem_1fr] sm:gap-3 print:grid print:grid-cols-[38mm_1fr] print:gap-3">
      <dt className="text-sm font-semibold tracking-wide text-muted uppercase print:text-[8pt]">
        {term}
      </dt>
      <dd className="min-w-0 break-words">{children}</dd>
    </div>
  );
}

const statusOrder = ['installed', 'at-shop', 'in-hand', 'ordered', 'planned', 'returned'] as const;
const statusWords: Record<(typeof statusOrder)[number], string> = {
  installed: 'on the truck',
  'at-shop': 'out at a shop',
  'in-hand': 'in the garage',
  ordered: 'on order',
  planned: 'on the list',
  returned: 'sent back',
};

function Summary({ view }: { view: BuildView }) {
  const s = view.summary;
  const e = view.estimate;
  const t = view.install?.totals;
  const money = view.money;
  const cash = (cents: number) => (money ? formatMoney(cents, money.currency) : '');
  return (
    <section aria-labelledby="sheet-summary">
      <h2 id="sheet-summary" className="mb-1 text-xl font-bold print:text-[13pt]">
        Summary
      </h2>
      <dl>
        {s && (
          <>
            <Line term="Vehicle">{vehicleLine(s) || 'Not given'}</Line>
            <Line term="Engine">
              {[s.engineDescription, engineFacts(s)].filter(Boolean).join(' · ')}
            </Line>
            <Line term="Transmission">{s.transmission || 'Not given'}</Line>
            <Line term="Power">
              {s.stockPowerHp != null && `Stock ${powerText(s.stockPowerHp, s.stockPowerBasis)} → `}
              target <strong>{powerText(s.targetPowerHp, s.targetPowerBasis)}</strong>
              {s.targetTorqueLbft != null && `, ${formatNumber(s.targetTorqueLbft, 0)} lbf·ft`}
            </Line>
            {(s.targetDate || s.targetEvent) && (
              <Line term="When">
                {[s.targetEvent, s.targetDate && dateText(s.targetDate)].filter(Boolean).join(', ')}
              </Line>
            )}
          </>
        )}
        {e && (
          <Line term="Weakest link">
            {e.weakestLink ? (
              <>
                <strong>{e.weakestLink.name}</strong> ({e.weakestLink.categoryLabel},{' '}
                {headroomText(e.weakestLink.headroomPct)} headroom)
                {e.supported &&
                  `; the build as planned supports about ${powerText(e.supported.crankHp, 'crank')} (${powerText(e.supported.wheelHp, 'wheel')})`}
              </>
            ) : (
              'No rated part yet'
            )}
          </Line>
        )}
        {view.parts && (
          <Line term="Parts">
            {view.parts.total === 0
              ? 'None listed'
              : `${view.parts.total} parts: ` +
                statusOrder
                  .filter((k) => view.parts!.byStatus[k])
                  .map((k) => `${view.parts!.byStatus[k]} ${statusWords[k]}`)
                  .join(', ')}
          </Line>
        )}
        {t && (
          <Line term="Install">
            {t.steps === 0
              ? 'No steps logged'
              : `${t.signedOff} of ${t.steps} steps signed off (${percent(t.signedOff, t.steps)} %)`}
          </Line>
        )}
        {t && t.positionsTotal > 0 && (
          <Line term="Torque record">
            {t.positionsRecorded} of {t.positionsTotal} fastener positions read on {t.fasteners}{' '}
            specs: {t.inSpec} in spec
            {t.outOfSpec > 0 ? <strong>, {t.outOfSpec} out of spec</strong> : ', none out of spec'}
          </Line>
        )}
        {view.dyno && (
          <Line term="Dyno">
            {view.dyno.best ? (
              <>
                Best {dynoPower(view.dyno.best)}, {dynoTorque(view.dyno.best)} on{' '}
                {dateText(view.dyno.best.date)}
                {view.dyno.vsTarget &&
                  (view.dyno.vsTarget.reached
                    ? '; target reached'
                    : `; ${Math.min(99, Math.floor(view.dyno.vsTarget.progressPct))} % of the target`)}{' '}
                ({standardLabels[view.dyno.standard] ?? view.dyno.standard})
              </>
            ) : (
              'No complete pull yet'
            )}
          </Line>
        )}
        {view.bench && view.bench.sheets.length > 0 && (
          <Line term="Bench">
            {(() => {
              const last = view.bench.sheets[view.bench.sheets.length - 1];
              return `${last.partName}, ${last.occasion} (${dateText(last.testedOn)}): ${last.verdict}`;
            })()}
          </Line>
        )}
        {money && (
          <Line term="Money">
            Budget {cash(money.budgetCents)} · planned {cash(money.plannedCents)} · committed{' '}
            {cash(money.committedCents)} · spent {cash(money.spentCents)}
          </Line>
        )}
      </dl>
      {e && e.warnings.length > 0 && (
        <ul className="mt-3 flex flex-col gap-1 text-[15px] print:text-[9pt]">
          {e.warnings.map((w, i) => (
            <li key={i} className="break-inside-avoid border-l-[3px] border-tight pl-2">
              {w.message}
            </li>
          ))}
        </ul>
      )}
    </section>
  );
}

/** The build sheet: a summary first (a page or two), then the full lists from a new page. */
export function BuildSheet({ view, printedOn }: { view: BuildView; printedOn: string }) {
  const s = view.summary;
  return (
    <article className="text-ink print:text-[10pt] print:leading-snug">
      <header className="mb-4 border-b-2 border-ink pb-3">
        <p className="text-sm font-semibold tracking-wide text-accent-700 uppercase print:text-[8pt]">
          Headroom build sheet{view.kind === 'public' ? ' · shared by the owner' : ''}
        </p>
        <h1 className="text-3xl leading-tight font-bold break-words print:text-[20pt]">
          {view.name}
        </h1>
        {s && (
          <p className="text-ink-2">
            {powerText(s.targetPowerHp, s.targetPowerBasis)} target
            {s.targetDate && ` by ${dateText(s.targetDate)}`}
          </p>
        )}
        <p className="text-sm text-muted print:text-[8pt]">Printed {dateText(printedOn)}</p>
      </header>
      <Summary view={view} />
      <SheetLists view={view} />
      <footer className="mt-6 border-t border-rule pt-2 text-sm text-muted print:text-[8pt]">
        Torque values come from the maker&rsquo;s service information; Headroom records them and
        checks readings against them. Estimates are estimates: ratings are the makers&rsquo; claims.
      </footer>
    </article>
  );
}
