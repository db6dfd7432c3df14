import { useParams } from 'react-router-dom';
import { LockKeyhole, Printer } from 'lucide-react';
import { can } from '@shared/permissions';
import type { Build } from '@shared/schemas/builds';
import { PageHeader } from '@/app/layouts/page-header';
import { ButtonLink } from '@/components/ui/button';
import { PageSpinner } from '@/components/ui/spinner';
import { EmptyState, ErrorState } from '@/components/ui/states';
import { paths } from '@/config/paths';
import { useBuild } from '@/features/builds/api/get-build';
import { useShare } from '@/features/sharing/api/get-share';
import { ShareAddress } from '@/features/sharing/components/share-address';
import { ShareChoices } from '@/features/sharing/components/share-choices';
import { SharePhotos } from '@/features/sharing/components/share-photos';
import { BuildLoadError } from './build-states';

/** "/builds/:buildId/share" — the owner's public page: its switch, address and what it shows. */
export function ShareRoute() {
  const { buildId = '' } = useParams();
  const build = useBuild(buildId);
  if (build.isPending) return <PageSpinner label="Loading the build…" />;
  if (build.isError) {
    return <BuildLoadError error={build.error} onRetry={() => void build.refetch()} />;
  }
  if (!can(build.data.myRole, 'share:manage')) return <OwnerOnly build={build.data} />;
  return <SharePage build={build.data} />;
}

function OwnerOnly({ build }: { build: Build }) {
  return (
    <>
      <title>{`Share · ${build.name} · Headroom`}</title>
      <EmptyState
        icon={<LockKeyhole aria-hidden className="size-6" />}
        title="Only the owner shares the build"
        titleAs="h1"
        actions={
          <ButtonLink to={paths.builds.sheet.getHref(build.id)} variant="secondary">
            Open the build sheet
          </ButtonLink>
        }
      >
        The owner decides whether the build has a public page and what it shows.
      </EmptyState>
    </>
  );
}

function SharePage({ build }: { build: Build }) {
  const share = useShare(build.id);
  return (
    <>
      <title>{`Share · ${build.name} · Headroom`}</title>
      <PageHeader
        title="Share the build"
        subtitle="A read-only page for friends, sponsors, a buyer or the people at the event."
        actions={
          <ButtonLink
            to={paths.builds.sheet.getHref(build.id)}
            variant="secondary"
            icon={<Printer aria-hidden className="size-4" />}
          >
            Build sheet
          </ButtonLink>
        }
      />
      {share.isPending ? (
        <PageSpinner label="Loading the sharing settings…" />
      ) : share.isError ? (
        <ErrorState
          title="Could not load the sharing settings"
          error={share.error}
          onRetry={() => void share.refetch()}
        />
      ) : (
        <div className="flex flex-col gap-5">
          <ShareAddress buildId={build.id} share={share.data} />
          <ShareChoices buildId={build.id} share={share.data} />
          <SharePhotos buildId={build.id} share={share.data} />
        </div>
      )}
    </>
  );
}
