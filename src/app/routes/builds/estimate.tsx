import { lazy, Suspense, useMemo, useState } from 'react';
import { useParams } from 'react-router-dom';
import { useQueryClient } from '@tanstack/react-query';
import {
  BarChart3,
  Calculator,
  Gauge,
  Info,
  ListChecks,
  Package,
  Settings2,
  TriangleAlert,
} from 'lucide-react';
import { capabilities, type Role } from '@shared/permissions';
import { powerBasisLabels } from '@shared/schemas/builds';
import { formatNumber } from '@shared/format';
import type { EstimateResult } from '@shared/schemas/estimate';
import { paths } from '@/config/paths';
import { isApiError } from '@/lib/api-client';
import { useBuild } from '@/features/builds/api/get-build';
import { useUpdateBuild } from '@/features/builds/api/update-build';
import { getEstimateQueryOptions, useEstimate } from '@/features/estimate/api/get-estimate';
import { AssumptionsPanel } from '@/features/estimate/components/assumptions-panel';
import { EstimateSummary, PreviewAnswer } from '@/features/estimate/components/estimate-summary';
import { PartsHeadroom, UnknownCategories } from '@/features/estimate/components/parts-headroom';
import { Requirements } from '@/features/estimate/components/requirements';
import { TargetPanel } from '@/features/estimate/components/target-panel';
import { BottomEndBanner, WarningsList } from '@/features/estimate/components/warnings';
import { whatIfEstimate } from '@/features/estimate/what-if';
import { PageHeader } from '@/app/layouts/page-header';
import { Badge } from '@/components/ui/badge';
import { ButtonLink } from '@/components/ui/button';
import { Section } from '@/components/ui/card';
import { PageSpinner, Spinner } from '@/components/ui/spinner';
import { EmptyState, ErrorState } from '@/components/ui/states';
import { BuildLoadError } from './build-states';

// recharts is the heaviest thing on the page: the words arrive first, the chart after.
const HeadroomChart = lazy(() =>
  import('@/features/estimate/components/headroom-chart').then((m) => ({
    default: m.HeadroomChart,
  })),
);

/** Which figures a section shows: the saved (server) estimate, or the browser's what-if. */
function SourceBadge({ preview }: { preview: boolean }) {
  return preview ? <Badge tone="accent">Preview</Badge> : <Badge tone="neutral">Saved</Badge>;
}

/** "/builds/:buildId/estimate" — the weakest link between the parts and the target. */
export function EstimateRoute() {
  const { buildId = '' } = useParams();
  const build = useBuild(buildId);
  const estimateQuery = useEstimate(buildId);

  if (build.isPending || estimateQuery.isPending) {
    return <PageSpinner label="Working out the estimate…" />;
  }
  if (build.isError) {
    return <BuildLoadError error={build.error} onRetry={() => void build.refetch()} />;
  }
  if (estimateQuery.isError) {
    if (isApiError(estimateQuery.error) && estimateQuery.error.status === 404) {
      return (
        <BuildLoadError error={estimateQuery.error} onRetry={() => void estimateQuery.refetch()} />
      );
    }
    return (
      <>
        <title>{`Power estimate · ${build.data.name} · Headroom`}</title>
        <PageHeader title="Power estimate" subtitle={<span>{build.data.name}</span>} />
        <ErrorState
          title="Could not work out the estimate"
          error={estimateQuery.error}
          onRetry={() => void estimateQuery.refetch()}
        />
      </>
    );
  }

  return (
    <EstimatePage
      // A new saved target starts the what-if over from it.
      key={`${estimateQuery.data.target.powerHp}-${estimateQuery.data.target.basis}`}
      buildId={buildId}
      buildName={build.data.name}
      role={build.data.myRole}
      saved={estimateQuery.data}
      refreshing={estimateQuery.isFetching}
    />
  );
}

function Caution() {
  return (
    <div
      className="flex gap-2.5 rounded-md border border-rule-strong bg-sheet px-3.5 py-3 text-[15px] text-ink-2"
      data-testid="estimate-caution"
    >
      <Info aria-hidden className="mt-0.5 size-5 shrink-0 text-ink-3" />
      <p>
        <strong className="text-ink">Estimates are estimates.</strong> Each rating is its maker’s
        claim, and the formulas are simplifications of a real engine. An estimate with no warnings
        is not a guarantee that nothing will break.
      </p>
    </div>
  );
}

function EstimatePage({
  buildId,
  buildName,
  role,
  saved,
  refreshing,
}: {
  buildId: string;
  buildName: string;
  role: Role;
  saved: EstimateResult;
  refreshing: boolean;
}) {
  const queryClient = useQueryClient();
  const updateBuild = useUpdateBuild();
  const [preview, setPreview] = useState<number | null>(null);
  const previewResult = useMemo(
    () => (preview === null ? null : whatIfEstimate(saved, preview)),
    [saved, preview],
  );
  const isPreview = previewResult !== null;
  const shown = previewResult ?? saved;
  const { canEditBuild, canEditAssumptions, canEditPartFully } = capabilities(role);
  const hasRated = shown.components.length > 0;

  const saveTarget = async (powerHp: number) => {
    await updateBuild.mutateAsync({ buildId, input: { targetPowerHp: powerHp } });
    // The page remounts on the new saved target once the server's estimate for it is in.
    await queryClient.invalidateQueries({ queryKey: getEstimateQueryOptions(buildId).queryKey });
  };

  return (
    <>
      <title>{`Power estimate · ${buildName} · Headroom`}</title>
      <PageHeader
        title="Power estimate"
        subtitle={<span>{buildName}</span>}
        badges={
          <span className="flex items-center gap-2 text-base">
            {isPreview ? (
              <Badge tone="accent">Preview: not saved</Badge>
            ) : (
              <Badge tone="neutral">Saved estimate, from the server</Badge>
            )}
            {refreshing && (
              <span className="flex items-center gap-1.5 text-sm text-muted" role="status">
                <Spinner className="size-4" /> Updating…
              </span>
            )}
          </span>
        }
      />

      <div className="flex flex-col gap-5">
        <Section
          id="target"
          title="Target"
          icon={<Gauge aria-hidden className="size-5 text-accent-600" />}
          actions={
            canEditBuild ? (
              <ButtonLink to={paths.builds.edit.getHref(buildId)} variant="ghost" size="sm">
                Edit the build
              </ButtonLink>
            ) : undefined
          }
        >
          <TargetPanel
            saved={saved}
            preview={isPreview ? preview : null}
            onPreview={setPreview}
            onSaveTarget={canEditBuild ? (hp) => void saveTarget(hp).catch(() => {}) : undefined}
            savingTarget={updateBuild.isPending}
            saveError={updateBuild.isError ? updateBuild.error.message : undefined}
            previewAnswer={previewResult ? <PreviewAnswer result={previewResult} /> : undefined}
          />
        </Section>

        <BottomEndBanner
          result={shown}
          preview={
            isPreview && preview !== null
              ? `${formatNumber(preview, 1)} ${powerBasisLabels[saved.target.basis]}`
              : null
          }
        />

        <Section
          id="answer"
          title="Weakest link"
          icon={<Calculator aria-hidden className="size-5 text-accent-600" />}
          actions={<SourceBadge preview={isPreview} />}
        >
          {hasRated ? (
            <EstimateSummary result={shown} />
          ) : (
            <EmptyState
              icon={<Package aria-hidden className="size-6" />}
              title="No rated parts yet"
              titleAs="h2"
              actions={
                <ButtonLink to={paths.builds.parts.getHref(buildId)} variant="secondary">
                  Go to the parts ledger
                </ButtonLink>
              }
            >
              Give parts the rating their maker quotes (crank hp, lbf·ft, mm³/stroke, lb/min, L/h)
              in the parts ledger, and each is checked against the target here. Until then nothing
              is checked: every category below is unknown.
            </EmptyState>
          )}
        </Section>

        <Caution />
        {role === 'shop' && (
          <p className="text-sm text-muted" data-testid="estimate-shop-note">
            Parts not sent to you are shown by category only, as “Another part”; their ratings still
            count in every figure.
          </p>
        )}

        <Section
          id="warnings"
          title="Warnings"
          icon={<TriangleAlert aria-hidden className="size-5 text-tight" />}
          actions={<SourceBadge preview={isPreview} />}
        >
          <WarningsList warnings={shown.warnings} />
        </Section>

        {hasRated && (
          <Section
            id="chart"
            title="Headroom by part"
            icon={<BarChart3 aria-hidden className="size-5 text-accent-600" />}
            actions={<SourceBadge preview={isPreview} />}
          >
            <Suspense fallback={<PageSpinner label="Drawing the chart…" />}>
              <HeadroomChart result={shown} tightMarginPct={shown.assumptions.tightMarginPct} />
            </Suspense>
          </Section>
        )}

        <Section
          id="parts"
          title="Rated parts"
          icon={<ListChecks aria-hidden className="size-5 text-accent-600" />}
          actions={<SourceBadge preview={isPreview} />}
        >
          <div className="flex flex-col gap-4">
            {hasRated ? (
              <PartsHeadroom result={shown} buildId={buildId} canEditRatings={canEditPartFully} />
            ) : (
              <p className="text-ink-2">No part has a rating yet.</p>
            )}
            <UnknownCategories result={shown} />
          </div>
        </Section>

        <Section
          id="requirements"
          title="What the target needs"
          icon={<Gauge aria-hidden className="size-5 text-ink-3" />}
          actions={<SourceBadge preview={isPreview} />}
        >
          <Requirements result={shown} />
        </Section>

        <Section
          id="assumptions"
          title="Assumptions"
          icon={<Settings2 aria-hidden className="size-5 text-ink-3" />}
        >
          <AssumptionsPanel buildId={buildId} canEdit={canEditAssumptions} saved={saved} />
        </Section>
      </div>
    </>
  );
}
