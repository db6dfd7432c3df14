import { useParams } from 'react-router-dom';
import { BellRing } from 'lucide-react';
import { useBuild } from '@/features/builds/api/get-build';
import { useNoticePreferences } from '@/features/notices/api/get-notice-preferences';
import { NoticePreferencesForm } from '@/features/notices/components/notice-preferences-form';
import { useUser } from '@/lib/auth';
import { PageHeader } from '@/app/layouts/page-header';
import { Section } from '@/components/ui/card';
import { PageSpinner } from '@/components/ui/spinner';
import { ErrorState } from '@/components/ui/states';
import { BuildLoadError } from './build-states';

/** "/builds/:buildId/notices": which e-mails I get about this build. Each member sets their own. */
export function NoticesRoute() {
  const { buildId = '' } = useParams();
  const user = useUser();
  const build = useBuild(buildId);
  const preferences = useNoticePreferences(buildId);

  if (build.isPending) return <PageSpinner label="Loading the build…" />;
  if (build.isError) {
    return <BuildLoadError error={build.error} onRetry={() => void build.refetch()} />;
  }
  const b = build.data;

  let body;
  if (preferences.isPending) {
    body = <PageSpinner label="Loading your notices…" />;
  } else if (preferences.isError) {
    body = (
      <ErrorState
        title="Could not load your notices"
        error={preferences.error}
        onRetry={() => void preferences.refetch()}
      />
    );
  } else {
    body = <NoticePreferencesForm buildId={b.id} preferences={preferences.data} />;
  }

  return (
    <>
      <title>{`Notices · ${b.name} · Headroom`}</title>
      <PageHeader
        title="Notices"
        subtitle={<span>Short e-mails when something happens on this build</span>}
      />
      <div className="grid gap-5 lg:grid-cols-[minmax(0,2fr)_minmax(0,1fr)] lg:items-start">
        <Section
          id="notice-choices"
          title="What to tell me"
          icon={<BellRing aria-hidden className="size-5 text-ink-3" />}
        >
          {body}
        </Section>
        <aside className="flex flex-col gap-2 rounded-lg border border-rule bg-sheet/70 px-4 py-4 text-[15px] text-ink-2 sm:px-5">
          <p>
            Sent to <span className="font-semibold break-all text-ink">{user.email}</span>.
          </p>
          <p>Only for this build: each build has its own choices, and so does each member.</p>
          <p>You never get a notice about something you did yourself.</p>
          {b.myRole === 'shop' && (
            <p>As a shop, you hear only about the parts sent to you and the steps that use them.</p>
          )}
        </aside>
      </div>
    </>
  );
}
