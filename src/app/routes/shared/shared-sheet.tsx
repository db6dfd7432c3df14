import { useParams, useSearchParams } from 'react-router-dom';
import { ChevronLeft } from 'lucide-react';
import { Link } from 'react-router-dom';
import { paths } from '@/config/paths';
import { isApiError } from '@/lib/api-client';
import { PageSpinner } from '@/components/ui/spinner';
import { ErrorState } from '@/components/ui/states';
import { NotShared } from '@/features/sharing/components/not-shared';
import { useSharedBuild } from '@/features/sharing/api/get-shared-build';
import { BuildSheet } from '@/features/sharing/components/build-sheet';
import { SheetControls, paperOf } from '@/features/sharing/components/sheet-controls';
import { deviceToday } from '@shared/dates';

/** "/shared/:token/sheet" — the public page as a build sheet for print: never money. */
export function SharedSheetRoute() {
  const { token = '' } = useParams();
  const shared = useSharedBuild(token);
  const [search, setSearch] = useSearchParams();
  const paper = paperOf(search.get('paper'));

  if (shared.isPending) return <PageSpinner label="Loading the build sheet…" />;
  if (shared.isError) {
    if (isApiError(shared.error) && shared.error.status === 404) {
      return <NotShared />;
    }
    return (
      <ErrorState
        title="Could not load this build"
        titleAs="h1"
        error={shared.error}
        onRetry={() => void shared.refetch()}
      />
    );
  }
  return (
    <>
      <title>{`Build sheet · ${shared.data.name} · Headroom`}</title>
      <Link
        to={paths.shared.page.getHref(token)}
        className="-ml-1 mb-2 inline-flex min-h-11 items-center gap-1 rounded px-1 font-semibold text-accent-700 hover:underline print:hidden"
      >
        <ChevronLeft aria-hidden className="size-4" />
        Back to the build’s page
      </Link>
      <SheetControls
        paper={paper}
        onPaper={(p) => setSearch(p === 'letter' ? {} : { paper: p }, { replace: true })}
      />
      <BuildSheet view={shared.data} printedOn={deviceToday()} />
    </>
  );
}
