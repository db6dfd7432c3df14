import { useMemo } from 'react';
import { useParams } from 'react-router-dom';
import { ArrowLeftRight, Droplets, Plus } from 'lucide-react';
import { can } from '@shared/permissions';
import type { Build } from '@shared/schemas/builds';
import type { BenchSheetSummary } from '@shared/schemas/bench';
import type { Part } from '@shared/schemas/parts';
import { PageHeader } from '@/app/layouts/page-header';
import { ButtonLink } from '@/components/ui/button';
import { Section } from '@/components/ui/card';
import { PageSpinner } from '@/components/ui/spinner';
import { EmptyState, ErrorState } from '@/components/ui/states';
import { paths } from '@/config/paths';
import { useBuild } from '@/features/builds/api/get-build';
import { useBenchSheets } from '@/features/bench/api/get-bench-sheets';
import { SheetList } from '@/features/bench/components/sheet-list';
import { useParts } from '@/features/parts/api/get-parts';
import { holderOf } from '@/features/parts/components/send-outs';
import { BuildLoadError } from './build-states';

/** "/builds/:buildId/bench" — the flow-bench sheets of each injector set of the build. */
export function BenchRoute() {
  const { buildId = '' } = useParams();
  const build = useBuild(buildId);
  if (build.isPending) return <PageSpinner label="Loading the build…" />;
  if (build.isError) {
    return <BuildLoadError error={build.error} onRetry={() => void build.refetch()} />;
  }
  return <BenchPage build={build.data} />;
}

function BenchPage({ build }: { build: Build }) {
  const parts = useParts(build.id);
  const sheets = useBenchSheets(build.id);
  const role = build.myRole;
  const canWrite = can(role, 'bench:write');

  const injectorSets = useMemo(
    () => (parts.data ?? []).filter((p) => p.category === 'fuel-injection'),
    [parts.data],
  );
  const byPart = useMemo(() => {
    const map = new Map<string, BenchSheetSummary[]>();
    for (const s of sheets.data ?? []) map.set(s.partId, [...(map.get(s.partId) ?? []), s]);
    return map;
  }, [sheets.data]);

  // Full cards for the sets with sheets or out at a shop; the other fuel-injection parts
  // (a pump, lines, seals) in one short list, still open to a sheet.
  const main = injectorSets
    .filter((p) => byPart.has(p.id) || p.status === 'at-shop' || role === 'shop')
    .sort((a, b) => Number(byPart.has(b.id)) - Number(byPart.has(a.id)));
  const rest = injectorSets.filter((p) => !main.includes(p));

  const header = (
    <>
      <title>{`Bench results · ${build.name} · Headroom`}</title>
      <PageHeader
        title="Bench results"
        subtitle={
          <span>{role === 'shop' ? `Your flow-bench sheets for ${build.name}` : build.name}</span>
        }
      />
    </>
  );

  if (parts.isPending || sheets.isPending) {
    return (
      <>
        {header}
        <PageSpinner label="Loading the bench sheets…" />
      </>
    );
  }
  if (parts.isError || sheets.isError) {
    const error = parts.error ?? sheets.error;
    return (
      <>
        {header}
        <ErrorState
          title="Could not load the bench sheets"
          error={error}
          onRetry={() => {
            void parts.refetch();
            void sheets.refetch();
          }}
        />
      </>
    );
  }
  if (injectorSets.length === 0) {
    return (
      <>
        {header}
        <EmptyState
          icon={<Droplets aria-hidden className="size-6" />}
          title={role === 'shop' ? 'No injectors have been sent to you' : 'No injector sets yet'}
          actions={
            can(role, 'parts:create') ? (
              <ButtonLink to={paths.builds.parts.getHref(build.id)} variant="secondary">
                Go to the parts ledger
              </ButtonLink>
            ) : undefined
          }
        >
          {role === 'shop'
            ? 'When the owner sends an injector set to your shop, its flow-bench sheets go here.'
            : 'Bench sheets belong to fuel-injection parts. Add the injector set to the parts ledger under “Fuel injection”, then its sheets go here.'}
        </EmptyState>
      </>
    );
  }

  return (
    <>
      {header}
      <p className="mb-5 max-w-3xl text-ink-2">
        Each injector’s delivery at each test point, checked against the set and the maker’s
        figures. A matched set stays within about 1 % of its mean at full load; an injector whose
        return flow stands well above the rest is worn.
      </p>
      <div className="flex flex-col gap-5">
        {main.map((part) => (
          <PartSheets
            key={part.id}
            build={build}
            part={part}
            sheets={byPart.get(part.id) ?? []}
            canWrite={canWrite}
          />
        ))}
        {canWrite && rest.length > 0 && (
          <Section
            id="other-parts"
            title={main.length ? 'Other fuel-injection parts' : 'Fuel-injection parts'}
          >
            <p className="mb-3 text-sm text-muted">
              No bench sheets yet. Pumps, lines and seals seldom have one.
            </p>
            <ul className="divide-y divide-rule">
              {rest.map((part) => (
                <li
                  key={part.id}
                  className="flex flex-wrap items-center justify-between gap-2 py-2"
                >
                  <span className="min-w-0 font-semibold break-words">{part.name}</span>
                  {canWrite && (
                    <ButtonLink
                      to={paths.builds.benchNew.getHref(build.id, part.id)}
                      variant="ghost"
                      size="sm"
                      icon={<Plus aria-hidden className="size-4" />}
                    >
                      Add a sheet<span className="sr-only"> for {part.name}</span>
                    </ButtonLink>
                  )}
                </li>
              ))}
            </ul>
          </Section>
        )}
      </div>
    </>
  );
}

function PartSheets({
  build,
  part,
  sheets,
  canWrite,
}: {
  build: Build;
  part: Part;
  sheets: BenchSheetSummary[];
  canWrite: boolean;
}) {
  const holder = holderOf(part);
  const facts = [
    part.partNumber && `Part number ${part.partNumber}`,
    part.status === 'at-shop' && holder ? `Out at ${holder}` : null,
  ]
    .filter(Boolean)
    .join(' · ');
  return (
    <Section
      id={`part-${part.id}`}
      title={part.name}
      icon={<Droplets aria-hidden className="size-5 text-accent-600" />}
      actions={
        <div className="flex flex-wrap gap-2">
          {sheets.length >= 2 && (
            <ButtonLink
              to={paths.builds.benchCompare.getHref(
                build.id,
                sheets[0]!.id,
                sheets[sheets.length - 1]!.id,
              )}
              variant="secondary"
              size="sm"
              icon={<ArrowLeftRight aria-hidden className="size-4" />}
            >
              Compare
            </ButtonLink>
          )}
          {canWrite && (
            <ButtonLink
              to={paths.builds.benchNew.getHref(build.id, part.id)}
              size="sm"
              icon={<Plus aria-hidden className="size-4" />}
            >
              Add a sheet<span className="sr-only"> for {part.name}</span>
            </ButtonLink>
          )}
        </div>
      }
    >
      {facts && <p className="mb-3 text-sm text-muted">{facts}</p>}
      {sheets.length ? (
        <SheetList buildId={build.id} sheets={sheets} label={`Bench sheets of ${part.name}`} />
      ) : (
        <p className="text-muted">
          No bench sheets yet.
          {canWrite && ' Add the shop’s sheet when the set comes off the bench.'}
        </p>
      )}
    </Section>
  );
}
