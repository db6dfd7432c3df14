import { useState } from 'react';
import { Link } from 'react-router-dom';
import { LogIn, LogOut } from 'lucide-react';
import type { User } from '@shared/schemas/auth';
import type { InvitationPreview } from '@shared/schemas/invitations';
import { Alert } from '@/components/ui/alert';
import { Button, ButtonLink } from '@/components/ui/button';
import { paths } from '@/config/paths';
import { isApiError } from '@/lib/api-client';
import { textLinkClasses } from '@/components/ui/text-link';
import { useAcceptInvitation, type AcceptInvitationResult } from '../api/accept-invitation';
import { useSignOutHere } from '../api/sign-out-here';
import { JoinBuildForm } from './join-build-form';

function errorText(error: unknown, fallback: string): string {
  return isApiError(error) ? error.message : fallback;
}

/** Signed in with the invited address: one click. */
function AcceptAsMe({
  token,
  user,
  onJoined,
}: {
  token: string;
  user: User;
  onJoined: (result: AcceptInvitationResult) => void;
}) {
  const accept = useAcceptInvitation();
  return (
    <div className="flex flex-col gap-3">
      <p className="text-[15px] text-ink-2">
        You're signed in as <span className="font-semibold">{user.displayName}</span>.
      </p>
      {accept.isError && (
        <Alert tone="error">{errorText(accept.error, 'Could not accept it. Try again.')}</Alert>
      )}
      <Button
        className="w-full"
        pending={accept.isPending}
        onClick={() => accept.mutate({ token, input: {} }, { onSuccess: onJoined })}
      >
        Accept and open the build
      </Button>
    </div>
  );
}

/** Signed in, but not with the invited address: a forwarded link must not add someone else. */
function WrongAccount({ invitedEmail, user }: { invitedEmail: string; user: User }) {
  const signOut = useSignOutHere();
  return (
    <div className="flex flex-col gap-3">
      <Alert tone="warning" title="This invitation is for another address">
        It was sent to <span className="font-semibold break-words">{invitedEmail}</span>, and you're
        signed in as <span className="font-semibold break-words">{user.email}</span>. Sign out, then
        sign in with the invited address (or create its account) to accept.
      </Alert>
      {signOut.isError && (
        <Alert tone="error">{errorText(signOut.error, 'Could not sign out. Try again.')}</Alert>
      )}
      <Button
        variant="secondary"
        className="w-full"
        pending={signOut.isPending}
        icon={<LogOut aria-hidden className="size-4" />}
        onClick={() => signOut.mutate()}
      >
        Sign out
      </Button>
      <p className="text-sm text-muted">
        Meant to use this account? Ask the owner to invite {user.email} instead.
      </p>
    </div>
  );
}

/** Signed out, and the invited address has an account: sign in, come back, accept. */
function SignInToAccept({ token, email }: { token: string; email: string }) {
  const here = paths.auth.invite.getHref(token);
  return (
    <div className="flex flex-col gap-3">
      <p className="text-[15px] text-ink-2">
        This address already has a Headroom account. Sign in with it, and you come back here to
        accept.
      </p>
      <ButtonLink
        to={paths.auth.signIn.getHref(here)}
        className="w-full"
        icon={<LogIn aria-hidden className="size-4" />}
      >
        Sign in to accept
      </ButtonLink>
      <p className="text-center">
        <Link
          to={paths.auth.forgotPassword.getHref()}
          state={{ email }}
          className={textLinkClasses}
        >
          Forgot your password?
        </Link>
      </p>
    </div>
  );
}

/** What the visitor can do with a usable invitation, depending on who they are. */
export function InvitationAnswer({
  token,
  invitation,
  user,
  onJoined,
}: {
  token: string;
  invitation: InvitationPreview;
  user: User | null;
  onJoined: (result: AcceptInvitationResult) => void;
}) {
  // Set when creating the account found that one exists after all (made since the page loaded).
  const [accountFound, setAccountFound] = useState(false);

  if (user) {
    return user.email.toLowerCase() === invitation.email.toLowerCase() ? (
      <AcceptAsMe token={token} user={user} onJoined={onJoined} />
    ) : (
      <WrongAccount invitedEmail={invitation.email} user={user} />
    );
  }
  if (invitation.accountExists || accountFound) {
    return <SignInToAccept token={token} email={invitation.email} />;
  }
  return (
    <JoinBuildForm
      token={token}
      email={invitation.email}
      onJoined={onJoined}
      onAccountExists={() => setAccountFound(true)}
    />
  );
}
