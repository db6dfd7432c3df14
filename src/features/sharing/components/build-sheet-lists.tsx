import type { ReactNode } from 'react';
import { formatMoney, formatNumber } from '@shared/format';
import type { BuildView } from '@shared/schemas/sharing';
import {
  dateText,
  dynoPower,
  dynoTorque,
  headroomText,
  readingsText,
  stepStatusLabels,
  torqueSpecText,
} from './view-text';

const th = 'border-b-2 border-ink px-1.5 py-1 text-left align-bottom font-semibold';
const td = 'border-b border-rule px-1.5 py-1 align-top';

/** A table that scrolls sideways on a phone (reachable by keyboard) and prints whole. */
function Table({ label, children }: { label: string; children: ReactNode }) {
  return (
    <div
      role="region"
      aria-label={label}
      tabIndex={0}
      className="overflow-x-auto print:overflow-visible"
    >
      <table className="w-full min-w-[34rem] border-collapse text-[15px] print:min-w-0 print:text-[9pt]">
        {children}
      </table>
    </div>
  );
}

function ListSection({ id, title, children }: { id: string; title: string; children: ReactNode }) {
  return (
    <section aria-labelledby={id} className="mt-6">
      <h2 id={id} className="mb-2 text-xl font-bold break-after-avoid print:text-[13pt]">
        {title}
      </h2>
      {children}
    </section>
  );
}

function Parts({ parts, currency }: { parts: NonNullable<BuildView['parts']>; currency?: string }) {
  const member = parts.categories.some((c) => c.parts.some((p) => p.vendor !== undefined));
  return (
    <ListSection id="sheet-parts" title="Parts by category">
      {parts.total === 0 ? (
        <p className="text-muted">No parts listed yet.</p>
      ) : (
        <Table label="Parts by category">
          <thead>
            <tr>
              <th className={th}>Part</th>
              <th className={th}>Status</th>
              <th className={th}>Rating</th>
              <th className={th}>Headroom</th>
              {member && <th className={th}>Vendor</th>}
              {currency && <th className={`${th} text-right`}>Total</th>}
            </tr>
          </thead>
          {parts.categories.map((c) => (
            <tbody key={c.category} className="break-inside-avoid">
              <tr>
                <th colSpan={6} scope="colgroup" className="pt-3 pb-1 text-left font-bold">
                  {c.label}
                </th>
              </tr>
              {c.parts.map((p, i) => (
                <tr key={i} className="break-inside-avoid">
                  <td className={td}>
                    {p.quantity > 1 && `${p.quantity} × `}
                    {p.name}
                  </td>
                  <td className={`${td} whitespace-nowrap`}>{p.statusLabel}</td>
                  <td className={td}>
                    {p.rating
                      ? `${formatNumber(p.rating.value, 1)} ${p.rating.unitLabel}${p.rating.for ? ` (${p.rating.for})` : ''}`
                      : '—'}
                  </td>
                  <td className={`${td} whitespace-nowrap`}>
                    {p.headroom ? headroomText(p.headroom.pct) : '—'}
                  </td>
                  {member && (
                    <td className={td}>
                      {[p.vendor, p.partNumber].filter(Boolean).join(' · ') || '—'}
                    </td>
                  )}
                  {currency && (
                    <td className={`${td} text-right whitespace-nowrap tabular-nums`}>
                      {p.totalCents !== undefined ? formatMoney(p.totalCents, currency) : '—'}
                    </td>
                  )}
                </tr>
              ))}
            </tbody>
          ))}
        </Table>
      )}
    </ListSection>
  );
}

function Torque({ install }: { install: NonNullable<BuildView['install']> }) {
  return (
    <ListSection id="sheet-torque" title="Install and torque record">
      {install.jobs.length === 0 ? (
        <p className="text-muted">No install work logged yet.</p>
      ) : (
        install.jobs.map((job, j) => (
          <div key={j} className="mb-3">
            <h3 className="font-bold break-after-avoid">{job.title}</h3>
            {job.steps.map((s, i) => (
              <div key={i} className="mt-1.5 break-inside-avoid">
                <p className="font-semibold">
                  {i + 1}. {s.title}{' '}
                  <span className="font-normal text-ink-2">
                    — {stepStatusLabels[s.status]}
                    {s.signOff &&
                      ` ${dateText(s.signOff.on)}${s.signOff.by ? ` by ${s.signOff.by}` : ''}${s.signOff.override ? ' (owner override)' : ''}`}
                    {s.checklist.total > 0 &&
                      ` · checklist ${s.checklist.done}/${s.checklist.total}`}
                  </span>
                </p>
                {s.fasteners.length > 0 && (
                  <Table label={`Torque specs of ${s.title}`}>
                    <thead>
                      <tr>
                        <th className={th}>Fastener</th>
                        <th className={th}>Spec</th>
                        <th className={th}>Readings</th>
                        <th className={th}>Re-torque</th>
                      </tr>
                    </thead>
                    <tbody>
                      {s.fasteners.map((f, k) => (
                        <tr key={k} className="break-inside-avoid">
                          <td className={td}>
                            {f.count} × {f.name}
                            {f.specSource && (
                              <span className="block text-sm text-muted print:text-[8pt]">
                                {f.specSource}
                              </span>
                            )}
                          </td>
                          <td className={td}>
                            {torqueSpecText(f)}, {f.threadCondition.toLowerCase()}
                            {f.finalAngleDeg !== null && ` + ${formatNumber(f.finalAngleDeg, 0)}°`}
                          </td>
                          <td
                            className={`${td} ${f.outOfSpec > 0 ? 'font-semibold text-over' : ''}`}
                          >
                            {readingsText(f)}
                          </td>
                          <td className={td}>
                            {f.retorque.asked
                              ? `${f.retorque.description}${f.retorque.closed ? ' — done' : ''}`
                              : '—'}
                          </td>
                        </tr>
                      ))}
                    </tbody>
                  </Table>
                )}
              </div>
            ))}
          </div>
        ))
      )}
    </ListSection>
  );
}

/** The full lists after the summary, from a new page when printed. */
export function SheetLists({ view }: { view: BuildView }) {
  return (
    <div className="break-before-page">
      {view.parts && <Parts parts={view.parts} currency={view.money?.currency} />}
      {view.install && <Torque install={view.install} />}
      {view.bench && view.bench.sheets.length > 0 && (
        <ListSection id="sheet-bench" title="Injector bench sheets">
          <Table label="Injector bench sheets">
            <thead>
              <tr>
                <th className={th}>Injector set</th>
                <th className={th}>Occasion</th>
                <th className={th}>Tested</th>
                <th className={th}>Verdict</th>
              </tr>
            </thead>
            <tbody>
              {view.bench.sheets.map((s, i) => (
                <tr key={i} className="break-inside-avoid">
                  <td className={td}>{s.partName}</td>
                  <td className={td}>{s.occasion}</td>
                  <td className={`${td} whitespace-nowrap`}>{dateText(s.testedOn)}</td>
                  <td className={td}>{s.verdict}</td>
                </tr>
              ))}
            </tbody>
          </Table>
        </ListSection>
      )}
      {view.dyno && view.dyno.sessions.length > 0 && (
        <ListSection id="sheet-dyno" title="Dyno days">
          <Table label="Dyno days">
            <thead>
              <tr>
                <th className={th}>Date</th>
                <th className={th}>Dyno</th>
                <th className={th}>Best power</th>
                <th className={th}>Best torque</th>
              </tr>
            </thead>
            <tbody>
              {view.dyno.sessions.map((s, i) => (
                <tr key={i} className="break-inside-avoid">
                  <td className={`${td} whitespace-nowrap`}>{dateText(s.date)}</td>
                  <td className={td}>
                    {s.dynoKind === 'chassis' ? 'Chassis' : 'Engine'}, {s.runCount}{' '}
                    {s.runCount === 1 ? 'pull' : 'pulls'}
                  </td>
                  <td className={td}>{s.best ? dynoPower(s.best) : 'No complete pull'}</td>
                  <td className={td}>{s.best ? dynoTorque(s.best) : '—'}</td>
                </tr>
              ))}
            </tbody>
          </Table>
        </ListSection>
      )}
    </div>
  );
}
