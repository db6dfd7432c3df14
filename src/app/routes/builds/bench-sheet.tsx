import { lazy, Suspense, useState } from 'react';
import { useNavigate, useParams } from 'react-router-dom';
import {
  ArrowLeftRight,
  BarChart3,
  Download,
  FileCheck2,
  Gauge,
  Info,
  ListChecks,
  Pencil,
  Table2,
  Trash2,
} from 'lucide-react';
import { canChangeBenchSheet, canDeleteBenchSheet } from '@shared/permissions';
import type { Build } from '@shared/schemas/builds';
import { type BenchSheetAnswer } from '@shared/schemas/bench';
import { PageHeader } from '@/app/layouts/page-header';
import { Alert } from '@/components/ui/alert';
import { Button, ButtonLink, buttonClasses } from '@/components/ui/button';
import { Section } from '@/components/ui/card';
import { ConfirmDialog } from '@/components/ui/confirm-dialog';
import { PageSpinner } from '@/components/ui/spinner';
import { ErrorState, NotFoundState } from '@/components/ui/states';
import { paths } from '@/config/paths';
import { isApiError } from '@/lib/api-client';
import { useUser } from '@/lib/auth';
import { useBuild } from '@/features/builds/api/get-build';
import { useDeleteBenchSheet } from '@/features/bench/api/delete-bench-sheet';
import { useBenchSheet } from '@/features/bench/api/get-bench-sheet';
import { useBenchSheets } from '@/features/bench/api/get-bench-sheets';
import { getBenchCsvHref } from '@/features/bench/api/paths';
import { Findings } from '@/features/bench/components/findings';
import { ImbalancePanel } from '@/features/bench/components/imbalance-panel';
import { OriginalPanel } from '@/features/bench/components/original-panel';
import { ReplaceFromCsv } from '@/features/bench/components/replace-from-csv';
import { SheetStatusBadge } from '@/features/bench/components/sheet-status-badge';
import { SheetDetails } from '@/features/bench/components/sheet-details';
import { SheetTable } from '@/features/bench/components/sheet-table';
import { dateText } from '@/features/bench/lib/format';
import { BuildLoadError } from './build-states';

// recharts is the heaviest thing on the page: the table and the words arrive first.
const PointCharts = lazy(() =>
  import('@/features/bench/components/point-charts').then((m) => ({
    default: m.PointCharts,
  })),
);

/** "/builds/:buildId/bench/sheets/:sheetId" — one flow-bench sheet, judged. */
export function BenchSheetRoute() {
  const { buildId = '', sheetId = '' } = useParams();
  const build = useBuild(buildId);
  const sheet = useBenchSheet(buildId, sheetId);
  if (build.isPending) return <PageSpinner label="Loading the build…" />;
  if (build.isError) {
    return <BuildLoadError error={build.error} onRetry={() => void build.refetch()} />;
  }
  const back = { to: paths.builds.bench.getHref(buildId), label: 'Bench results' };
  if (sheet.isPending) return <PageSpinner label="Loading the bench sheet…" />;
  if (sheet.isError) {
    if (isApiError(sheet.error) && sheet.error.status === 404) {
      return (
        <>
          <title>Bench sheet not found · Headroom</title>
          <NotFoundState
            title="Bench sheet not found"
            titleAs="h1"
            actions={
              <ButtonLink to={back.to} variant="secondary">
                Back to the bench results
              </ButtonLink>
            }
          >
            It may have been deleted.
          </NotFoundState>
        </>
      );
    }
    return (
      <ErrorState
        title="Could not load the bench sheet"
        titleAs="h1"
        error={sheet.error}
        onRetry={() => void sheet.refetch()}
      />
    );
  }
  return <SheetPage build={build.data} answer={sheet.data} />;
}

function SheetPage({ build, answer }: { build: Build; answer: BenchSheetAnswer }) {
  const me = useUser();
  const navigate = useNavigate();
  const { sheet, result, imbalance, target } = answer;
  const siblings = useBenchSheets(build.id, sheet.partId);
  const remove = useDeleteBenchSheet();
  const [confirming, setConfirming] = useState(false);
  const role = build.myRole;
  const mayChange = canChangeBenchSheet(role, me.id, sheet);
  const mayDelete = canDeleteBenchSheet(role, me.id, sheet);
  // The set's sheets in test order: this one against the one before it (the first against the
  // latest), so "Compare" reads before → after.
  const list = siblings.data ?? [];
  const at = list.findIndex((s) => s.id === sheet.id);
  const compareWith =
    list.length < 2 || at < 0
      ? null
      : at > 0
        ? paths.builds.benchCompare.getHref(build.id, list[at - 1]!.id, sheet.id)
        : paths.builds.benchCompare.getHref(build.id, sheet.id, list[list.length - 1]!.id);

  return (
    <>
      <title>{`${sheet.occasion} · Bench results · ${build.name} · Headroom`}</title>
      <PageHeader
        back={{ to: paths.builds.bench.getHref(build.id), label: 'Bench results' }}
        title={sheet.occasion}
        subtitle={
          <span>
            {sheet.partName} · tested{' '}
            <time dateTime={sheet.testedOn}>{dateText(sheet.testedOn)}</time>
          </span>
        }
        badges={<SheetStatusBadge status={result.status} />}
        actions={
          <>
            {mayChange && (
              <ButtonLink
                to={paths.builds.benchEdit.getHref(build.id, sheet.id)}
                variant="secondary"
                icon={<Pencil aria-hidden className="size-4" />}
              >
                Edit
              </ButtonLink>
            )}
            {compareWith && (
              <ButtonLink
                to={compareWith}
                variant="secondary"
                icon={<ArrowLeftRight aria-hidden className="size-4" />}
              >
                Compare
              </ButtonLink>
            )}
          </>
        }
      />

      <div className="flex flex-col gap-5">
        <Section
          id="verdict"
          title="What the sheet says"
          icon={<ListChecks aria-hidden className="size-5 text-accent-600" />}
        >
          <Findings result={result} />
        </Section>

        <Section
          id="values"
          title="Values"
          icon={<Table2 aria-hidden className="size-5 text-accent-600" />}
          actions={
            <a
              href={getBenchCsvHref(build.id, sheet.id)}
              download
              className={buttonClasses('ghost', 'sm')}
            >
              <Download aria-hidden className="size-4" />
              CSV
            </a>
          }
        >
          <SheetTable
            result={result}
            caption={`${sheet.occasion}: each injector's value at each test point, with how far it is from the set's mean`}
          />
          <p className="mt-2 text-sm text-muted">
            Under each value: how far it is from the set’s mean (return flow: how many times the
            other injectors’ median). Shaded cells are out of tolerance, named in words.
          </p>
          {mayChange && (
            <div className="mt-4 border-t border-rule pt-4">
              <ReplaceFromCsv buildId={build.id} sheetId={sheet.id} />
            </div>
          )}
        </Section>

        <Section
          id="charts"
          title="Charts"
          icon={<BarChart3 aria-hidden className="size-5 text-accent-600" />}
        >
          <Suspense fallback={<PageSpinner label="Drawing the charts…" />}>
            <PointCharts result={result} />
          </Suspense>
        </Section>

        <Section
          id="imbalance"
          title="What the imbalance costs"
          icon={<Gauge aria-hidden className="size-5 text-accent-600" />}
        >
          <ImbalancePanel imbalance={imbalance} target={target} />
        </Section>

        <Section
          id="original"
          title="The shop’s original sheet"
          icon={<FileCheck2 aria-hidden className="size-5 text-accent-600" />}
        >
          <OriginalPanel
            buildId={build.id}
            sheet={sheet}
            canAttach={mayChange}
            canRemove={mayDelete}
          />
        </Section>

        <Section
          id="details"
          title="Details"
          icon={<Info aria-hidden className="size-5 text-ink-3" />}
        >
          <SheetDetails sheet={sheet} />
          {mayDelete && (
            <div className="mt-4 border-t border-rule pt-4">
              <Button
                variant="ghost"
                icon={<Trash2 aria-hidden className="size-4" />}
                onClick={() => {
                  remove.reset();
                  setConfirming(true);
                }}
              >
                Delete this sheet
              </Button>
            </div>
          )}
        </Section>
      </div>

      <ConfirmDialog
        open={confirming}
        title={`Delete “${sheet.occasion}”?`}
        confirmLabel="Delete sheet"
        pending={remove.isPending}
        onClose={() => setConfirming(false)}
        onConfirm={() =>
          remove.mutate(
            { buildId: build.id, sheetId: sheet.id },
            { onSuccess: () => void navigate(paths.builds.bench.getHref(build.id)) },
          )
        }
      >
        <p>Its values and its attached original go too. This cannot be undone.</p>
        {remove.isError && (
          <Alert tone="error" className="mt-3">
            {isApiError(remove.error) ? remove.error.message : 'Could not delete it. Try again.'}
          </Alert>
        )}
      </ConfirmDialog>
    </>
  );
}
