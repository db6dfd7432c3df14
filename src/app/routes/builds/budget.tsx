import { useParams } from 'react-router-dom';
import { ChartColumnBig, LockKeyhole, PiggyBank, TrendingUp } from 'lucide-react';
import { capabilities } from '@shared/permissions';
import type { Build } from '@shared/schemas/builds';
import { PageHeader } from '@/app/layouts/page-header';
import { ButtonLink } from '@/components/ui/button';
import { Section } from '@/components/ui/card';
import { PageSpinner } from '@/components/ui/spinner';
import { EmptyState, ErrorState } from '@/components/ui/states';
import { paths } from '@/config/paths';
import { isApiError } from '@/lib/api-client';
import { useBuild } from '@/features/builds/api/get-build';
import { useBudget } from '@/features/budget/api/get-budget';
import { CategoryChart, SpendingChart } from '@/features/budget/components/budget-charts';
import {
  BudgetMeter,
  BudgetTotals,
  CategoryTable,
  OverBudgetBanner,
} from '@/features/budget/components/budget-summary';
import { BuildLoadError } from './build-states';

/** "/builds/:buildId/budget" — the owner's money: totals, categories and spending over time. */
export function BudgetRoute() {
  const { buildId = '' } = useParams();
  const build = useBuild(buildId);

  if (build.isPending) return <PageSpinner label="Loading the build…" />;
  if (build.isError) {
    return <BuildLoadError error={build.error} onRetry={() => void build.refetch()} />;
  }
  return <BudgetPage build={build.data} />;
}

function OwnerOnly({ build }: { build: Build }) {
  return (
    <>
      <title>{`Budget · ${build.name} · Headroom`}</title>
      <EmptyState
        icon={<LockKeyhole aria-hidden className="size-6" />}
        title="Only the owner sees money"
        titleAs="h1"
        actions={
          <ButtonLink to={paths.builds.parts.getHref(build.id)} variant="secondary">
            Go to the parts
          </ButtonLink>
        }
      >
        The budget of this build is visible to its owners only. Parts, their status and dates are on
        the Parts page.
      </EmptyState>
    </>
  );
}

function BudgetPage({ build }: { build: Build }) {
  const { canSeeBudget } = capabilities(build.myRole);
  const budget = useBudget(build.id, { enabled: canSeeBudget });

  if (!canSeeBudget) return <OwnerOnly build={build} />;
  if (budget.isPending) return <PageSpinner label="Adding up the budget…" />;
  if (budget.isError) {
    if (isApiError(budget.error) && budget.error.status === 403) return <OwnerOnly build={build} />;
    return (
      <ErrorState
        title="Could not load the budget"
        titleAs="h1"
        error={budget.error}
        onRetry={() => void budget.refetch()}
      />
    );
  }

  const b = budget.data;
  const header = (
    <>
      <title>{`Budget · ${build.name} · Headroom`}</title>
      <PageHeader title="Budget" subtitle={<span>{build.name}</span>} />
    </>
  );

  if (b.totals.partCount === 0) {
    return (
      <>
        {header}
        <EmptyState
          icon={<PiggyBank aria-hidden className="size-6" />}
          title="Nothing to add up yet"
          actions={
            <ButtonLink to={paths.builds.parts.getHref(build.id)}>
              Add parts to the ledger
            </ButtonLink>
          }
        >
          The budget is built from the parts ledger: planned, committed and spent money per
          category.
        </EmptyState>
      </>
    );
  }

  return (
    <>
      {header}
      <div className="flex flex-col gap-5">
        <OverBudgetBanner budget={b} buildId={build.id} />
        <BudgetTotals budget={b} buildId={build.id} />
        <BudgetMeter budget={b} />
        <Section
          id="by-category"
          title="By category"
          icon={<ChartColumnBig aria-hidden className="size-5 text-ink-3" />}
        >
          <figure className="flex flex-col gap-4">
            <figcaption className="text-[15px] text-ink-2">
              Planned against spent in each category; the table gives every figure.
            </figcaption>
            <div aria-hidden>
              <CategoryChart budget={b} />
            </div>
            <CategoryTable budget={b} />
          </figure>
        </Section>
        <Section
          id="over-time"
          title="Spending over time"
          icon={<TrendingUp aria-hidden className="size-5 text-ink-3" />}
        >
          {b.spendingOverTime.length === 0 ? (
            <p className="text-muted">Nothing has been ordered yet, so nothing is committed.</p>
          ) : (
            <figure className="flex flex-col gap-3">
              <figcaption className="text-[15px] text-ink-2">
                Money committed (ordered or later) and spent (in hand or later), added up by the
                date each part was ordered.
              </figcaption>
              <div aria-hidden>
                <SpendingChart budget={b} />
              </div>
            </figure>
          )}
        </Section>
      </div>
    </>
  );
}
