import { Link } from 'react-router-dom';
import { Gauge, Flag } from 'lucide-react';
import type { Build } from '@shared/schemas/builds';
import { paths } from '@/config/paths';
import { Countdown } from './countdown';
import { RoleBadge } from '@/components/ui/role-badge';
import { powerText, vehicleLine } from './build-text';

/** One build in "My builds". The whole card is the link (through the name's stretched link). */
export function BuildCard({ build }: { build: Build }) {
  const vehicle = vehicleLine(build);
  return (
    <article className="relative flex h-full flex-col gap-3 rounded-lg border border-rule bg-sheet p-4 transition-shadow focus-within:shadow-md hover:border-rule-strong hover:shadow-md">
      <div className="flex items-start justify-between gap-3">
        <h2 className="min-w-0 text-xl leading-snug font-bold break-words">
          <Link
            to={paths.builds.overview.getHref(build.id)}
            className="after:absolute after:inset-0 after:rounded-lg focus:outline-none"
          >
            {build.name}
          </Link>
        </h2>
        <RoleBadge role={build.myRole} />
      </div>
      {vehicle && <p className="-mt-2 text-ink-2">{vehicle}</p>}
      <div className="mt-auto flex flex-wrap items-center gap-x-4 gap-y-2 border-t border-rule pt-3 text-[15px]">
        <span className="flex items-center gap-1.5 font-semibold text-ink">
          <Gauge aria-hidden className="size-4 text-accent-600" />
          <span className="sr-only">Target: </span>
          {powerText(build.targetPowerHp, build.targetPowerBasis)}
        </span>
        {build.targetEvent && (
          <span className="flex min-w-0 items-center gap-1.5 text-ink-2">
            <Flag aria-hidden className="size-4 shrink-0" />
            <span className="truncate">{build.targetEvent}</span>
          </span>
        )}
        <Countdown date={build.targetDate} timeZone={build.timeZone} className="ml-auto" />
      </div>
    </article>
  );
}

export function BuildCardSkeleton() {
  return (
    <div
      aria-hidden
      className="flex h-36 animate-pulse flex-col gap-3 rounded-lg border border-rule bg-sheet p-4"
    >
      <div className="h-6 w-2/3 rounded bg-ink/10" />
      <div className="h-4 w-1/2 rounded bg-ink/10" />
      <div className="mt-auto h-5 w-1/3 rounded bg-ink/10" />
    </div>
  );
}
