import type { ReactNode } from 'react';
import { Flag } from 'lucide-react';
import type { BuildView } from '@shared/schemas/sharing';
import { AtAGlance } from './at-a-glance';
import { BenchSection, CrewSection, DynoSection, PhotosSection } from './public-results';
import { EstimateSection, InstallSection, PartsSection, TruckSection } from './public-sections';
import { dateText, engineFacts, powerText, vehicleLine } from './view-text';

/** A shared build as a visitor sees it: what its owner chose to show, read-only. */
export function PublicBuild({ view, actions }: { view: BuildView; actions?: ReactNode }) {
  const s = view.summary;
  const nothing =
    !s &&
    !view.parts &&
    !view.estimate &&
    !view.install &&
    !view.bench &&
    !view.dyno &&
    !view.photos?.length &&
    !view.crew;
  return (
    <article className="flex flex-col gap-5">
      <header className="flex flex-col gap-4 md:flex-row-reverse md:items-start">
        {view.cover && (
          <img
            src={view.cover.webUrl}
            alt={view.cover.caption || view.name}
            width={view.cover.width}
            height={view.cover.height}
            className="aspect-[4/3] w-full rounded-lg border border-rule object-cover md:w-80 md:shrink-0"
          />
        )}
        <div className="flex min-w-0 flex-1 flex-col gap-3 sm:flex-row sm:items-start sm:justify-between">
          <div className="min-w-0">
            <p className="text-sm font-semibold tracking-wide text-accent-700 uppercase">
              A build shared on Headroom
            </p>
            <h1 className="text-3xl leading-tight font-bold tracking-tight break-words sm:text-[2.1rem]">
              {view.name}
            </h1>
            {s && (
              <>
                <p className="mt-1 text-lg text-ink-2">
                  {[vehicleLine(s), engineFacts(s)].filter(Boolean).join(' · ')}
                </p>
                <p className="mt-1 flex flex-wrap items-center gap-x-2 text-ink-2">
                  <span>
                    Target{' '}
                    <strong className="text-ink">
                      {powerText(s.targetPowerHp, s.targetPowerBasis)}
                    </strong>
                  </span>
                  {(s.targetEvent || s.targetDate) && (
                    <span className="inline-flex items-center gap-1.5">
                      <Flag aria-hidden className="size-4 text-ink-3" />
                      {[s.targetEvent, s.targetDate && dateText(s.targetDate)]
                        .filter(Boolean)
                        .join(', ')}
                    </span>
                  )}
                </p>
              </>
            )}
          </div>
          {actions && <div className="flex shrink-0 flex-wrap gap-2">{actions}</div>}
        </div>
      </header>
      <AtAGlance view={view} />
      {nothing && (
        <p className="rounded-lg border border-dashed border-rule-strong bg-sheet/70 px-5 py-8 text-center text-muted">
          The owner has not chosen anything to show here yet.
        </p>
      )}
      <div className="grid gap-5 lg:grid-cols-2 lg:items-start">
        {s && <TruckSection summary={s} />}
        {view.estimate && <EstimateSection estimate={view.estimate} />}
        {view.dyno && <DynoSection dyno={view.dyno} />}
        {view.bench && <BenchSection bench={view.bench} />}
      </div>
      {view.parts && <PartsSection parts={view.parts} />}
      {view.install && <InstallSection install={view.install} />}
      {view.photos && <PhotosSection photos={view.photos} />}
      {view.crew && <CrewSection crew={view.crew} />}
      <footer className="border-t border-rule pt-4 text-sm text-muted">
        Shared read-only by the build&rsquo;s owner. Torque specs come from the maker&rsquo;s
        service information; estimates are estimates.
      </footer>
    </article>
  );
}
