/** The public page's results and people: bench sheets, dyno days, photos, the crew. */
import { Activity, Camera, Droplets, Users } from 'lucide-react';
import type { BuildView } from '@shared/schemas/sharing';
import { Section } from '@/components/ui/card';
import { sectionIcon as icon } from './public-sections';
import { dateText, dynoPower, dynoTorque, powerText, roleNames, standardLabels } from './view-text';

type View = BuildView;

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
              Best so far:{' '}
              <strong>{powerText(dyno.vsTarget.achievedHp, dyno.vsTarget.basis)}</strong>,{' '}
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
