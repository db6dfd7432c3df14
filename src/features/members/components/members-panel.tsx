import { Users } from 'lucide-react';
import type { Build } from '@shared/schemas/builds';
import { can, roleDescriptions, roleLabels, roles } from '@shared/permissions';
import { Section } from '@/components/ui/card';
import { PageSpinner } from '@/components/ui/spinner';
import { ErrorState } from '@/components/ui/states';
import { useUser } from '@/lib/auth';
import { useMembers } from '../api/get-members';
import { MemberRow } from './member-row';

const roleOrder = Object.fromEntries(roles.map((role, index) => [role, index]));

/** "Crew & access": who is on the build with which role; owners manage it here. */
export function MembersPanel({ build }: { build: Build }) {
  const user = useUser();
  const members = useMembers(build.id);
  const canManage = can(build.myRole, 'members:manage');

  let body;
  if (members.isPending) {
    body = <PageSpinner label="Loading the crew…" />;
  } else if (members.isError) {
    body = (
      <ErrorState
        title="Could not load the crew"
        error={members.error}
        onRetry={() => void members.refetch()}
      />
    );
  } else if (members.data.length === 0) {
    body = <p className="text-muted">Nobody is on this build yet.</p>;
  } else {
    const sorted = [...members.data].sort(
      (a, b) =>
        (roleOrder[a.role] ?? 9) - (roleOrder[b.role] ?? 9) ||
        a.displayName.localeCompare(b.displayName),
    );
    body = (
      <ul aria-label="Members" className="divide-y divide-rule">
        {sorted.map((member) => (
          <MemberRow
            key={member.userId}
            buildId={build.id}
            member={member}
            isMe={member.userId === user.id}
            canManage={canManage}
          />
        ))}
      </ul>
    );
  }

  return (
    <Section
      id="crew"
      title="Crew & access"
      icon={<Users aria-hidden className="size-5 text-ink-3" />}
      actions={
        members.data && (
          <span className="text-sm text-muted">
            {members.data.length} {members.data.length === 1 ? 'person' : 'people'}
          </span>
        )
      }
    >
      <div className="flex flex-col gap-5">
        {body}
        {canManage && (
          <p className="-mb-3 text-sm text-ink-2">
            To bring someone in,{' '}
            <a href="#invitations" className="font-semibold text-accent-700 underline">
              invite them by e-mail
            </a>
            : with or without a Headroom account, they join from the link.
          </p>
        )}
        {canManage && (
          <details className="text-sm text-ink-2">
            <summary className="min-h-11 cursor-pointer py-2 font-semibold text-accent-700">
              What each role can do
            </summary>
            <dl className="mt-1 grid gap-2">
              {roles.map((role) => (
                <div key={role}>
                  <dt className="inline font-semibold">{roleLabels[role]}: </dt>
                  <dd className="inline">{roleDescriptions[role]}</dd>
                </div>
              ))}
            </dl>
          </details>
        )}
      </div>
    </Section>
  );
}
