import { useState } from 'react';
import { flushSync } from 'react-dom';
import { useNavigate, useParams } from 'react-router-dom';
import { roleDescriptions } from '@shared/permissions';
import { invitationErrorCodes as codes, invitationValidDays } from '@shared/schemas/invitations';
import { formatTimestampDate } from '@shared/format';
import { paths } from '@/config/paths';
import { useMe } from '@/lib/me';
import { AuthCard } from '@/features/auth/components/auth-card';
import { RoleBadge } from '@/components/ui/role-badge';
import type { AcceptInvitationResult } from '@/features/invitations/api/accept-invitation';
import { useInvitationLink } from '@/features/invitations/api/get-invitation-link';
import { InvitationAnswer } from '@/features/invitations/components/invitation-answer';
import { isApiError } from '@/lib/api-client';
import { ButtonLink } from '@/components/ui/button';
import { PageSpinner } from '@/components/ui/spinner';
import { ErrorState, NotFoundState } from '@/components/ui/states';

// The server's message repeats the title; the page says what to do next instead.
const refusals: Record<string, { title: string; text: string }> = {
  [codes.notFound]: {
    title: 'This invitation link is not valid',
    text: 'Check that the whole link was copied from the mail, or ask the owner of the build for a new one.',
  },
  [codes.expired]: {
    title: 'This invitation has expired',
    text: `Invitations work for ${invitationValidDays} days. Ask the owner of the build to send it again.`,
  },
  [codes.revoked]: {
    title: 'This invitation was withdrawn',
    text: 'The owner of the build took it back. Ask them if you think that is a mistake.',
  },
  [codes.used]: {
    title: 'This invitation has already been used',
    text: 'Each link works once. If it was you who accepted it, sign in to open the build.',
  },
};

function Invitation({
  token,
  onJoined,
}: {
  token: string;
  onJoined: (result: AcceptInvitationResult) => void;
}) {
  const link = useInvitationLink(token);
  const me = useMe();

  if (link.isPending || me.isPending) return <PageSpinner label="Opening the invitation…" />;

  if (link.isError) {
    const { error } = link;
    const next = me.data ? (
      <ButtonLink to={paths.builds.list.getHref()}>Go to My builds</ButtonLink>
    ) : (
      <ButtonLink to={paths.auth.signIn.getHref()}>Sign in</ButtonLink>
    );
    if (isApiError(error) && error.status === 404) {
      return (
        <NotFoundState
          title={refusals[error.code]?.title ?? 'This invitation cannot be used'}
          titleAs="h1"
          actions={next}
        >
          {refusals[error.code]?.text ?? error.message}
        </NotFoundState>
      );
    }
    return (
      <ErrorState
        title="Could not open the invitation"
        titleAs="h1"
        error={error}
        onRetry={() => void link.refetch()}
      />
    );
  }

  const inv = link.data;
  return (
    <AuthCard
      wide
      title={`Join ${inv.buildName}`}
      lead={`${inv.inviterName ?? 'The owner'} invited you to this build on Headroom.`}
    >
      <dl className="mb-5 grid grid-cols-[auto_1fr] gap-x-4 gap-y-2 rounded-md border border-rule bg-paper/60 px-4 py-3 text-[15px]">
        <dt className="text-muted">Your role</dt>
        <dd>
          <RoleBadge role={inv.role} />
          <span className="mt-1 block text-sm text-ink-2">{roleDescriptions[inv.role]}</span>
        </dd>
        <dt className="text-muted">Sent to</dt>
        <dd className="break-words">{inv.email}</dd>
        <dt className="text-muted">Expires</dt>
        <dd>{formatTimestampDate(inv.expiresAt)}</dd>
      </dl>
      <InvitationAnswer token={token} invitation={inv} user={me.data ?? null} onJoined={onJoined} />
    </AuthCard>
  );
}

/** "/invite/:token": the page behind the link in an invitation mail; public. */
export function InviteRoute() {
  const { token = '' } = useParams();
  const navigate = useNavigate();
  const [opening, setOpening] = useState<string | null>(null);

  return (
    <>
      <title>Invitation · Headroom</title>
      {opening ? (
        <PageSpinner label={`Opening ${opening}…`} />
      ) : (
        <Invitation
          token={token}
          onJoined={({ build }) => {
            // The link is used now: drop its view before the new session's cache reset
            // re-renders it into a refetch (which would answer "already used").
            flushSync(() => setOpening(build.name));
            void navigate(paths.builds.overview.getHref(build.id), { replace: true });
          }}
        />
      )}
    </>
  );
}
