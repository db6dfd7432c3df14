import { lazy, Suspense, useState } from 'react';
import { MailPlus } from 'lucide-react';
import { can } from '@shared/permissions';
import type { Build } from '@shared/schemas/builds';
import { Button } from '@/components/ui/button';
import { Section } from '@/components/ui/card';
import { Modal } from '@/components/ui/modal';
import { PageSpinner } from '@/components/ui/spinner';
import { ErrorState } from '@/components/ui/states';
import { useInvitations } from '../api/get-invitations';
import { InvitationRow } from './invitation-row';

// The form (and its form library) loads when the owner opens it, not with the overview.
const InviteForm = lazy(() => import('./invite-form').then((m) => ({ default: m.InviteForm })));

/**
 * "Invitations": the owner's invite-by-e-mail dialog and the invitations still waiting for an answer.
 * Renders nothing for other roles (the API would refuse them anyway).
 */
export function InvitationsPanel({ build }: { build: Build }) {
  const canManage = can(build.myRole, 'invitations:manage');
  const invitations = useInvitations(build.id, { enabled: canManage });
  const [inviting, setInviting] = useState(false);
  if (!canManage) return null;

  let list;
  if (invitations.isPending) {
    list = <PageSpinner label="Loading invitations…" />;
  } else if (invitations.isError) {
    list = (
      <ErrorState
        title="Could not load the invitations"
        error={invitations.error}
        onRetry={() => void invitations.refetch()}
      />
    );
  } else if (invitations.data.length === 0) {
    list = (
      <p className="text-muted">None waiting. Invitations show here until they are accepted.</p>
    );
  } else {
    list = (
      <ul aria-label="Pending invitations" className="divide-y divide-rule">
        {invitations.data.map((invitation) => (
          <InvitationRow key={invitation.id} buildId={build.id} invitation={invitation} />
        ))}
      </ul>
    );
  }

  const waiting = invitations.data?.length;

  return (
    <Section
      id="invitations"
      title="Invite by e-mail"
      icon={<MailPlus aria-hidden className="size-5 text-ink-3" />}
    >
      <div className="flex flex-col gap-5">
        <p className="-mb-1 text-ink-2">
          The one way to bring someone in: they get a link and join with the role you choose. With a
          Headroom account they sign in; without one, they create it on the way.
        </p>
        <div>
          <Button
            variant="secondary"
            icon={<MailPlus aria-hidden className="size-4" />}
            onClick={() => setInviting(true)}
          >
            Invite someone
          </Button>
        </div>
        <Modal open={inviting} title="Invite someone" onClose={() => setInviting(false)}>
          <Suspense fallback={<PageSpinner label="Loading the form…" />}>
            <InviteForm buildId={build.id} />
          </Suspense>
        </Modal>
        <div className="flex flex-col gap-3 border-t border-rule pt-4">
          <h3 className="flex items-baseline gap-2 font-bold">
            Pending invitations
            {waiting ? <span className="text-sm font-normal text-muted">({waiting})</span> : null}
          </h3>
          {list}
        </div>
      </div>
    </Section>
  );
}
