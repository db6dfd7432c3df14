import { useMemo } from 'react';
import { useNavigate, useParams, useSearchParams } from 'react-router-dom';
import { Droplets } from 'lucide-react';
import { can, canChangeBenchSheet } from '@shared/permissions';
import type { Build } from '@shared/schemas/builds';
import type { BenchSheetAnswer } from '@shared/schemas/bench';
import { PageHeader } from '@/app/layouts/page-header';
import { ButtonLink } from '@/components/ui/button';
import { PageSpinner } from '@/components/ui/spinner';
import { EmptyState, ErrorState, NotFoundState } from '@/components/ui/states';
import { paths } from '@/config/paths';
import { isApiError } from '@/lib/api-client';
import { useUser } from '@/lib/auth';
import { buildToday } from '@shared/dates';
import { useBuild } from '@/features/builds/api/get-build';
import { useCreateBenchSheet } from '@/features/bench/api/create-bench-sheet';
import { useBenchSheet } from '@/features/bench/api/get-bench-sheet';
import { useUpdateBenchSheet } from '@/features/bench/api/update-bench-sheet';
import { SheetEntryForm } from '@/features/bench/components/sheet-entry-form';
import { emptySheetForm, sheetFormFrom } from '@/features/bench/lib/sheet-form';
import { useParts } from '@/features/parts/api/get-parts';
import { BuildLoadError } from './build-states';

/** "/builds/:buildId/bench/new?partId=" and "/builds/:buildId/bench/sheets/:sheetId/edit". */
export function BenchEntryRoute() {
  const { buildId = '', sheetId } = useParams();
  const build = useBuild(buildId);
  if (build.isPending) return <PageSpinner label="Loading the build…" />;
  if (build.isError) {
    return <BuildLoadError error={build.error} onRetry={() => void build.refetch()} />;
  }
  return sheetId ? (
    <EditSheet build={build.data} sheetId={sheetId} />
  ) : (
    <EntryPage build={build.data} answer={null} />
  );
}

function EditSheet({ build, sheetId }: { build: Build; sheetId: string }) {
  const sheet = useBenchSheet(build.id, sheetId);
  if (sheet.isPending) return <PageSpinner label="Loading the bench sheet…" />;
  if (sheet.isError) {
    if (isApiError(sheet.error) && sheet.error.status === 404) {
      return (
        <NotFoundState
          title="Bench sheet not found"
          titleAs="h1"
          actions={
            <ButtonLink to={paths.builds.bench.getHref(build.id)} variant="secondary">
              Back to the bench results
            </ButtonLink>
          }
        >
          It may have been deleted.
        </NotFoundState>
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
  return <EntryPage build={build} answer={sheet.data} />;
}

function EntryPage({ build, answer }: { build: Build; answer: BenchSheetAnswer | null }) {
  const me = useUser();
  const navigate = useNavigate();
  const [search] = useSearchParams();
  const parts = useParts(build.id);
  const create = useCreateBenchSheet();
  const update = useUpdateBenchSheet();
  const role = build.myRole;
  const editing = answer !== null;
  const cylinders = answer?.cylinders ?? build.cylinders;
  const injectorSets = useMemo(
    () => (parts.data ?? []).filter((p) => p.category === 'fuel-injection'),
    [parts.data],
  );
  const wantedPart = search.get('partId') ?? '';
  const defaults = useMemo(
    () =>
      answer
        ? sheetFormFrom(answer.sheet, cylinders)
        : emptySheetForm(
            cylinders,
            injectorSets.some((p) => p.id === wantedPart)
              ? wantedPart
              : injectorSets.length === 1
                ? injectorSets[0]!.id
                : '',
            buildToday(build),
          ),
    [answer, cylinders, injectorSets, wantedPart, build],
  );

  const title = editing ? `Edit “${answer.sheet.occasion}”` : 'Add a bench sheet';
  const back = editing
    ? {
        to: paths.builds.benchSheet.getHref(build.id, answer.sheet.id),
        label: answer.sheet.occasion,
      }
    : { to: paths.builds.bench.getHref(build.id), label: 'Bench results' };
  const header = (
    <>
      <title>{`${title} · ${build.name} · Headroom`}</title>
      <PageHeader
        back={back}
        title={title}
        subtitle={
          <span>
            {build.name} · {cylinders} injectors
          </span>
        }
      />
    </>
  );

  const allowed = editing
    ? canChangeBenchSheet(role, me.id, answer.sheet)
    : can(role, 'bench:write');
  if (!allowed) {
    return (
      <>
        {header}
        <EmptyState icon={<Droplets aria-hidden className="size-6" />} title="Read only">
          {editing
            ? 'A shop’s bench sheet is changed only by that shop or the owner.'
            : 'Your role on this build reads the bench sheets; it does not add them.'}
        </EmptyState>
      </>
    );
  }
  if (parts.isPending) {
    return (
      <>
        {header}
        <PageSpinner label="Loading the injector sets…" />
      </>
    );
  }
  if (parts.isError) {
    return (
      <>
        {header}
        <ErrorState
          title="Could not load the injector sets"
          error={parts.error}
          onRetry={() => void parts.refetch()}
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
          title="No injector set to put a sheet on"
        >
          Bench sheets belong to fuel-injection parts of the build
          {role === 'shop' ? ' that were sent to your shop.' : '.'}
        </EmptyState>
      </>
    );
  }

  return (
    <>
      {header}
      <SheetEntryForm
        key={answer?.sheet.id ?? 'new'}
        cylinders={cylinders}
        parts={injectorSets}
        defaultValues={defaults}
        submitLabel={editing ? 'Save changes' : 'Save the sheet'}
        onCancel={() => void navigate(back.to)}
        onSubmit={async (input) => {
          const saved = editing
            ? await update.mutateAsync({ buildId: build.id, sheetId: answer.sheet.id, input })
            : await create.mutateAsync({ buildId: build.id, input });
          await navigate(paths.builds.benchSheet.getHref(build.id, saved.sheet.id));
        }}
      />
    </>
  );
}
