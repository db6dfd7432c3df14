import { useMemo } from 'react';
import { useParams, useSearchParams } from 'react-router-dom';
import { ArrowLeftRight } from 'lucide-react';
import type { Build } from '@shared/schemas/builds';
import type { BenchSheetSummary } from '@shared/schemas/bench';
import { PageHeader } from '@/app/layouts/page-header';
import { ButtonLink } from '@/components/ui/button';
import { FormField, SelectInput } from '@/components/ui/form-field';
import { PageSpinner } from '@/components/ui/spinner';
import { EmptyState, ErrorState } from '@/components/ui/states';
import { paths } from '@/config/paths';
import { useBuild } from '@/features/builds/api/get-build';
import { useBenchComparison } from '@/features/bench/api/get-bench-comparison';
import { useBenchSheets } from '@/features/bench/api/get-bench-sheets';
import { ComparisonView } from '@/features/bench/components/comparison-view';
import { SheetStatusBadge } from '@/features/bench/components/sheet-status-badge';
import { dateText } from '@/features/bench/lib/format';
import { BuildLoadError } from './build-states';

/** "/builds/:buildId/bench/compare?before=&after=" — two sheets of one injector set. */
export function BenchCompareRoute() {
  const { buildId = '' } = useParams();
  const build = useBuild(buildId);
  if (build.isPending) return <PageSpinner label="Loading the build…" />;
  if (build.isError) {
    return <BuildLoadError error={build.error} onRetry={() => void build.refetch()} />;
  }
  return <ComparePage build={build.data} />;
}

const optionText = (s: BenchSheetSummary) => `${s.occasion} (${dateText(s.testedOn)})`;

function ComparePage({ build }: { build: Build }) {
  const [search, setSearch] = useSearchParams();
  const sheets = useBenchSheets(build.id);
  const list = useMemo(() => sheets.data ?? [], [sheets.data]);

  // Without a choice in the address: the first set with two sheets, its first and last.
  const fallback = useMemo(() => {
    const byPart = new Map<string, BenchSheetSummary[]>();
    for (const s of list) byPart.set(s.partId, [...(byPart.get(s.partId) ?? []), s]);
    const pair = [...byPart.values()].find((group) => group.length >= 2);
    return pair ? { before: pair[0]!.id, after: pair[pair.length - 1]!.id } : null;
  }, [list]);
  const manySets = new Set(list.map((s) => s.partId)).size > 1;
  const before = search.get('before') ?? fallback?.before ?? '';
  const beforeSheet = list.find((s) => s.id === before);
  const sameSet = list.filter((s) => beforeSheet && s.partId === beforeSheet.partId);
  const after = search.get('after') ?? fallback?.after ?? '';
  const afterSheet = sameSet.find((s) => s.id === after);
  const comparison = useBenchComparison(build.id, before, afterSheet ? after : '');

  const choose = (which: 'before' | 'after', id: string) => {
    const next = { before, after, [which]: id };
    if (which === 'before') {
      const part = list.find((s) => s.id === id)?.partId;
      const partner = list.filter((s) => s.partId === part && s.id !== id);
      if (!partner.some((s) => s.id === next.after)) next.after = partner.at(-1)?.id ?? '';
    }
    setSearch(next, { replace: true });
  };

  const header = (
    <>
      <title>{`Compare bench sheets · ${build.name} · Headroom`}</title>
      <PageHeader
        back={{ to: paths.builds.bench.getHref(build.id), label: 'Bench results' }}
        title="Compare bench sheets"
        subtitle={<span>{beforeSheet?.partName ?? build.name}</span>}
      />
    </>
  );

  if (sheets.isPending) {
    return (
      <>
        {header}
        <PageSpinner label="Loading the bench sheets…" />
      </>
    );
  }
  if (sheets.isError) {
    return (
      <>
        {header}
        <ErrorState
          title="Could not load the bench sheets"
          error={sheets.error}
          onRetry={() => void sheets.refetch()}
        />
      </>
    );
  }
  if (!fallback) {
    return (
      <>
        {header}
        <EmptyState
          icon={<ArrowLeftRight aria-hidden className="size-6" />}
          title="Nothing to compare yet"
          actions={
            <ButtonLink to={paths.builds.bench.getHref(build.id)} variant="secondary">
              Back to the bench results
            </ButtonLink>
          }
        >
          A comparison needs two sheets of the same injector set, e.g. “as received” and “after
          rebuild”.
        </EmptyState>
      </>
    );
  }

  return (
    <>
      {header}
      <div className="mb-5 grid grid-cols-1 gap-4 rounded-lg border border-rule bg-sheet px-4 py-4 sm:grid-cols-2 sm:px-5">
        <FormField label="Before">
          {(c) => (
            <SelectInput {...c} value={before} onChange={(e) => choose('before', e.target.value)}>
              {list.map((s) => (
                <option key={s.id} value={s.id}>
                  {optionText(s)}
                  {manySets && ` · ${s.partName}`}
                </option>
              ))}
            </SelectInput>
          )}
        </FormField>
        <FormField label="After">
          {(c) => (
            <SelectInput
              {...c}
              value={afterSheet ? after : ''}
              onChange={(e) => choose('after', e.target.value)}
            >
              {!afterSheet && <option value="">Choose…</option>}
              {sameSet
                .filter((s) => s.id !== before)
                .map((s) => (
                  <option key={s.id} value={s.id}>
                    {optionText(s)}
                  </option>
                ))}
            </SelectInput>
          )}
        </FormField>
        {beforeSheet && afterSheet && (
          <div className="flex flex-col gap-1 text-[15px] sm:col-span-2 sm:flex-row sm:gap-6">
            <p className="flex flex-wrap items-center gap-2">
              <span className="font-semibold">Before:</span>{' '}
              <SheetStatusBadge status={beforeSheet.status} />
            </p>
            <p className="flex flex-wrap items-center gap-2">
              <span className="font-semibold">After:</span>{' '}
              <SheetStatusBadge status={afterSheet.status} />
            </p>
          </div>
        )}
      </div>

      {!afterSheet ? (
        <EmptyState
          icon={<ArrowLeftRight aria-hidden className="size-6" />}
          title="Choose the later sheet"
        >
          Pick a second sheet of the same injector set to compare with.
        </EmptyState>
      ) : comparison.isPending ? (
        <PageSpinner label="Comparing…" />
      ) : comparison.isError ? (
        <ErrorState
          title="Could not compare these sheets"
          error={comparison.error}
          onRetry={() => void comparison.refetch()}
        />
      ) : (
        <ComparisonView answer={comparison.data} />
      )}
    </>
  );
}
