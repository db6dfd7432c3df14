import { useParams, useSearchParams } from 'react-router-dom';
import { LockKeyhole } from 'lucide-react';
import { can } from '@shared/permissions';
import type { Build } from '@shared/schemas/builds';
import { PageSpinner } from '@/components/ui/spinner';
import { EmptyState, ErrorState } from '@/components/ui/states';
import { useBuild } from '@/features/builds/api/get-build';
import { useBuildSheet } from '@/features/sharing/api/get-build-sheet';
import { BuildSheet } from '@/features/sharing/components/build-sheet';
import { deviceToday } from '@shared/dates';
import { SheetControls, paperOf, type Paper } from '@/features/sharing/components/sheet-controls';
import { BuildLoadError } from './build-states';

/** "/builds/:buildId/sheet" — the build sheet for print; `?money=1` on the owner's copy. */
export function BuildSheetRoute() {
  const { buildId = '' } = useParams();
  const build = useBuild(buildId);
  if (build.isPending) return <PageSpinner label="Loading the build…" />;
  if (build.isError) {
    return <BuildLoadError error={build.error} onRetry={() => void build.refetch()} />;
  }
  if (!can(build.data.myRole, 'sheet:read')) {
    return (
      <>
        <title>{`Build sheet · ${build.data.name} · Headroom`}</title>
        <EmptyState
          icon={<LockKeyhole aria-hidden className="size-6" />}
          title="The build sheet is for the owner, crew and followers"
          titleAs="h1"
        >
          A shop sees the parts sent to it on the Parts and Send-outs pages.
        </EmptyState>
      </>
    );
  }
  return <SheetPage build={build.data} />;
}

function SheetPage({ build }: { build: Build }) {
  const [search, setSearch] = useSearchParams();
  const mayShowMoney = can(build.myRole, 'money:read');
  const money = mayShowMoney && search.get('money') === '1';
  const paper = paperOf(search.get('paper'));
  const sheet = useBuildSheet(build.id, money);
  const set = (key: string, value: string | null) =>
    setSearch(
      (prev) => {
        const next = new URLSearchParams(prev);
        if (value === null) next.delete(key);
        else next.set(key, value);
        return next;
      },
      { replace: true },
    );

  return (
    <>
      <title>{`Build sheet · ${build.name} · Headroom`}</title>
      <SheetControls
        paper={paper}
        onPaper={(p: Paper) => set('paper', p === 'letter' ? null : p)}
        money={
          mayShowMoney ? { on: money, onChange: (on) => set('money', on ? '1' : null) } : undefined
        }
      />
      {sheet.isPending ? (
        <PageSpinner label="Loading the build sheet…" />
      ) : sheet.isError ? (
        <ErrorState
          title="Could not load the build sheet"
          titleAs="h1"
          error={sheet.error}
          onRetry={() => void sheet.refetch()}
        />
      ) : (
        <BuildSheet view={sheet.data.sheet} printedOn={deviceToday()} />
      )}
    </>
  );
}
