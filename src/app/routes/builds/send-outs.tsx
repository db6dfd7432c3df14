import { useCallback, useMemo } from 'react';
import { useParams } from 'react-router-dom';
import { PackageCheck, Truck, Wrench } from 'lucide-react';
import { buildToday } from '@shared/dates';
import { can } from '@shared/permissions';
import type { Build } from '@shared/schemas/builds';
import type { Part } from '@shared/schemas/parts';
import { PageHeader } from '@/app/layouts/page-header';
import { ButtonLink } from '@/components/ui/button';
import { Section } from '@/components/ui/card';
import { PageSpinner } from '@/components/ui/spinner';
import { EmptyState, ErrorState } from '@/components/ui/states';
import { paths } from '@/config/paths';
import { useBuild } from '@/features/builds/api/get-build';
import { useParts } from '@/features/parts/api/get-parts';
import { useUpdatePart } from '@/features/parts/api/update-part';
import { AtShopCard, BackFromShopRow, sortAtShop } from '@/features/parts/components/send-outs';
import { statusChange } from '@/features/parts/lib/status';
import { BuildLoadError } from './build-states';

/** "/builds/:buildId/send-outs" — what is away at a shop, for how long, and what came back. */
export function SendOutsRoute() {
  const { buildId = '' } = useParams();
  const build = useBuild(buildId);

  if (build.isPending) return <PageSpinner label="Loading the build…" />;
  if (build.isError) {
    return <BuildLoadError error={build.error} onRetry={() => void build.refetch()} />;
  }
  return <SendOutsPage build={build.data} />;
}

function SendOutsPage({ build }: { build: Build }) {
  const parts = useParts(build.id);
  const { mutateAsync: update } = useUpdatePart();
  const role = build.myRole;
  const canUpdate = can(role, 'parts:update');
  const quoteLabel =
    role === 'shop' ? 'Your quote' : can(role, 'money:read') ? 'Labor quote' : null;

  const onBack = useCallback(
    (part: Part) =>
      update({
        buildId: build.id,
        partId: part.id,
        input: statusChange(part, 'in-hand', buildToday(build)),
      }),
    [update, build],
  );

  const { atShop, back } = useMemo(() => {
    const list = parts.data ?? [];
    return {
      atShop: sortAtShop(list.filter((p) => p.status === 'at-shop')),
      back: list
        .filter((p) => p.backOn && p.status !== 'at-shop')
        .sort((a, b) => (b.backOn ?? '').localeCompare(a.backOn ?? '')),
    };
  }, [parts.data]);

  const header = (
    <>
      <title>{`Send-outs · ${build.name} · Headroom`}</title>
      <PageHeader
        title="Send-outs"
        subtitle={
          <span>{role === 'shop' ? `Parts of ${build.name} at your shop` : build.name}</span>
        }
      />
    </>
  );

  if (parts.isPending) {
    return (
      <>
        {header}
        <PageSpinner label="Loading the send-outs…" />
      </>
    );
  }
  if (parts.isError) {
    return (
      <>
        {header}
        <ErrorState
          title="Could not load the send-outs"
          error={parts.error}
          onRetry={() => void parts.refetch()}
        />
      </>
    );
  }
  if (atShop.length === 0 && back.length === 0) {
    return (
      <>
        {header}
        <EmptyState
          icon={<Truck aria-hidden className="size-6" />}
          title={
            role === 'shop' ? 'Nothing of this build is at your shop' : 'Nothing is out at a shop'
          }
          actions={
            role !== 'shop' ? (
              <ButtonLink to={paths.builds.parts.getHref(build.id)} variant="secondary">
                Go to the parts
              </ButtonLink>
            ) : undefined
          }
        >
          {role === 'shop'
            ? 'Parts the owner sends to you appear here with the promised turnaround.'
            : 'Set a part’s status to “Out at a shop” with the date it went and the promised turnaround, and it shows here.'}
        </EmptyState>
      </>
    );
  }

  const overdue = atShop.filter((p) => p.sendOut?.overdue).length;

  return (
    <>
      {header}
      <div className="flex flex-col gap-5">
        <Section
          id="at-shop"
          title="Out at a shop"
          icon={<Wrench aria-hidden className="size-5 text-ink-3" />}
          actions={
            <span className="text-[15px] text-ink-2">
              {atShop.length} {atShop.length === 1 ? 'part' : 'parts'}
              {overdue > 0 && <span className="font-semibold text-over">, {overdue} overdue</span>}
            </span>
          }
        >
          {atShop.length === 0 ? (
            <p className="text-muted">Nothing is at a shop right now.</p>
          ) : (
            <ul aria-label="Parts out at a shop" className="flex flex-col gap-3">
              {atShop.map((part) => (
                <AtShopCard
                  key={part.id}
                  part={part}
                  currency={build.currency}
                  quoteLabel={quoteLabel}
                  onBack={canUpdate ? onBack : undefined}
                />
              ))}
            </ul>
          )}
        </Section>

        <Section
          id="back"
          title="Back from a shop"
          icon={<PackageCheck aria-hidden className="size-5 text-ink-3" />}
        >
          {back.length === 0 ? (
            <p className="text-muted">Nothing has come back yet.</p>
          ) : (
            <ul aria-label="Parts back from a shop" className="divide-y divide-rule">
              {back.map((part) => (
                <BackFromShopRow key={part.id} part={part} />
              ))}
            </ul>
          )}
        </Section>
      </div>
    </>
  );
}
