import { useEffect, useMemo, useState } from 'react';
import { Link, useParams } from 'react-router-dom';
import { useQuery } from '@tanstack/react-query';
import { Camera } from 'lucide-react';
import { can, canCaptionPhoto } from '@shared/permissions';
import type { Build } from '@shared/schemas/builds';
import type { Photo } from '@shared/schemas/photos';
import { paths } from '@/config/paths';
import { PageHeader } from '@/app/layouts/page-header';
import { ButtonLink } from '@/components/ui/button';
import { PageSpinner } from '@/components/ui/spinner';
import { EmptyState, ErrorState } from '@/components/ui/states';
import { useUser } from '@/lib/auth';
import { useBuild } from '@/features/builds/api/get-build';
import { getJobsQueryOptions } from '@/features/install-log/api/get-jobs';
import { getPartsQueryOptions } from '@/features/parts/api/get-parts';
import { useBuildPhotos } from '@/features/photos/api/get-build-photos';
import { PhotoGrid } from '@/features/photos/components/photo-grid';
import { PhotoViewer } from '@/features/photos/components/photo-viewer';
import { BuildLoadError } from './build-states';

/** "/builds/:buildId/photos" — every photo of the build, newest first. */
export function PhotosRoute() {
  const { buildId = '' } = useParams();
  const build = useBuild(buildId);
  if (build.isPending) return <PageSpinner label="Loading the build…" />;
  if (build.isError) {
    return <BuildLoadError error={build.error} onRetry={() => void build.refetch()} />;
  }
  return <PhotosPage build={build.data} />;
}

type Where = { label: string; name: string; href: string };

/** Names of the steps and parts the photos belong to (from lists the pages already use). */
function useWhere(build: Build, photos: Photo[] | undefined) {
  const needSteps = photos?.some((p) => p.stepId) ?? false;
  const needParts = photos?.some((p) => p.partId) ?? false;
  const jobs = useQuery({ ...getJobsQueryOptions(build.id), enabled: needSteps });
  const parts = useQuery({ ...getPartsQueryOptions(build.id), enabled: needParts });
  return useMemo(() => {
    const map = new Map<string, Where>();
    for (const job of jobs.data ?? []) {
      for (const s of job.steps) {
        map.set(`step:${s.id}`, {
          label: 'Step',
          name: s.title,
          href: paths.builds.step.getHref(build.id, s.id),
        });
      }
    }
    for (const p of parts.data ?? []) {
      map.set(`part:${p.id}`, {
        label: 'Part',
        name: p.name,
        href: `${paths.builds.parts.getHref(build.id)}?q=${encodeURIComponent(p.name)}`,
      });
    }
    return (photo: Photo): Where | undefined =>
      photo.stepId
        ? map.get(`step:${photo.stepId}`)
        : photo.partId
          ? map.get(`part:${photo.partId}`)
          : undefined;
  }, [jobs.data, parts.data, build.id]);
}

function PhotosPage({ build }: { build: Build }) {
  // The app keeps no scroll position between pages: open at the top, not where the last page was.
  useEffect(() => {
    window.scrollTo(0, 0);
  }, []);
  const me = useUser();
  const photos = useBuildPhotos(build.id);
  const where = useWhere(build, photos.data);
  const [open, setOpen] = useState<number | null>(null);
  const role = build.myRole;

  const context = (onDark: boolean) => (photo: Photo) => {
    const w = where(photo);
    if (!w) return null;
    return (
      <p className={onDark ? 'text-[15px] text-white/85' : 'text-sm text-ink-2'}>
        {w.label}:{' '}
        <Link
          to={w.href}
          className={
            onDark
              ? 'font-semibold text-white underline underline-offset-2'
              : 'font-semibold text-accent-700 underline-offset-2 hover:underline'
          }
        >
          {w.name}
        </Link>
      </p>
    );
  };

  let body;
  if (photos.isPending) {
    body = <PageSpinner label="Loading the photos…" />;
  } else if (photos.isError) {
    body = (
      <ErrorState
        title="Could not load the photos"
        error={photos.error}
        onRetry={() => void photos.refetch()}
      />
    );
  } else if (photos.data.length === 0) {
    body = (
      <EmptyState
        icon={<Camera aria-hidden className="size-6" />}
        title="No photos yet"
        actions={
          can(role, 'install:write') ? (
            <ButtonLink to={paths.builds.install.getHref(build.id)} variant="secondary">
              Go to the install log
            </ButtonLink>
          ) : undefined
        }
      >
        {can(role, 'install:write')
          ? 'Photos are added on each install step (and on parts). They all show here.'
          : 'Photos of the install steps and parts show here once they are added.'}
      </EmptyState>
    );
  } else {
    body = (
      <PhotoGrid
        label="Photos of the build"
        photos={photos.data}
        onOpen={setOpen}
        context={context(false)}
      />
    );
  }

  return (
    <>
      <title>{`Photos · ${build.name} · Headroom`}</title>
      <PageHeader
        title="Photos"
        subtitle={
          <span>
            {build.name}
            {photos.data && photos.data.length > 0 && (
              <span className="text-muted">
                {' '}
                · {photos.data.length} photo{photos.data.length === 1 ? '' : 's'}, newest first
              </span>
            )}
          </span>
        }
      />
      {body}
      <PhotoViewer
        buildId={build.id}
        photos={photos.data ?? []}
        index={open}
        onIndex={setOpen}
        onClose={() => setOpen(null)}
        canCaption={(photo) => canCaptionPhoto(role, me.id, photo)}
        canDelete={can(role, 'photos:delete')}
        context={context(true)}
      />
    </>
  );
}
