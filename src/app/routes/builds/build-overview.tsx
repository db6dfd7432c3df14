import { useParams } from 'react-router-dom';
import { Pencil } from 'lucide-react';
import { capabilities } from '@shared/permissions';
import { paths } from '@/config/paths';
import { useBuild } from '@/features/builds/api/get-build';
import {
  BudgetSection,
  TargetSection,
  TruckSection,
} from '@/features/builds/components/build-details';
import { vehicleLine } from '@/features/builds/components/build-text';
import { DeleteBuild } from '@/features/builds/components/delete-build';
import { DynoProgressSection } from '@/features/dyno/components/dyno-progress';
import { RoleBadge } from '@/components/ui/role-badge';
import { MembersPanel } from '@/features/members/components/members-panel';
import { InvitationsPanel } from '@/features/invitations/components/invitations-panel';
import { TimelineSummary } from '@/features/timeline/components/timeline-summary';
import { ActivityList } from '@/features/activity/components/activity-list';
import { PageHeader } from '@/app/layouts/page-header';
import { ButtonLink } from '@/components/ui/button';
import { PageSpinner } from '@/components/ui/spinner';
import { BuildLoadError } from './build-states';

/** "/builds/:buildId" — the build at a glance, and its people. */
export function BuildOverviewRoute() {
  const { buildId = '' } = useParams();
  const build = useBuild(buildId);

  if (build.isPending) return <PageSpinner label="Loading the build…" />;
  if (build.isError) {
    return <BuildLoadError error={build.error} onRetry={() => void build.refetch()} />;
  }

  const b = build.data;
  const vehicle = vehicleLine(b);
  const { canEditBuild, canDeleteBuild, canInviteMembers } = capabilities(b.myRole);

  return (
    <>
      <title>{`${b.name} · Headroom`}</title>
      <PageHeader
        back={{ to: paths.builds.list.getHref(), label: 'My builds' }}
        title={b.name}
        subtitle={vehicle ? <span>{vehicle}</span> : undefined}
        badges={<RoleBadge role={b.myRole} prefix="You: " />}
        actions={
          <>
            {canEditBuild && (
              <ButtonLink
                to={paths.builds.edit.getHref(b.id)}
                variant="secondary"
                icon={<Pencil aria-hidden className="size-4" />}
              >
                Edit build
              </ButtonLink>
            )}
            {canDeleteBuild && <DeleteBuild build={b} />}
          </>
        }
      />
      <div className="grid gap-5 lg:grid-cols-2">
        <div className="flex flex-col gap-5">
          <TargetSection build={b} />
          <TimelineSummary buildId={b.id} />
          <DynoProgressSection build={b} />
        </div>
        <div className="flex flex-col gap-5">
          <TruckSection build={b} />
          <BudgetSection build={b} />
        </div>
        <div className="lg:col-span-2">
          <ActivityList build={b} />
        </div>
        {/* Owners get the invitations beside the crew; everyone else, the crew at full width. */}
        <div
          className={
            canInviteMembers
              ? 'grid gap-5 lg:col-span-2 lg:grid-cols-2 lg:items-start'
              : 'lg:col-span-2'
          }
        >
          <MembersPanel build={b} />
          <InvitationsPanel build={b} />
        </div>
      </div>
    </>
  );
}
