import { useState } from 'react';
import type { Invitation } from '@shared/schemas/invitations';
import { formatTimestampDate } from '@shared/format';
import { Alert } from '@/components/ui/alert';
import { Badge } from '@/components/ui/badge';
import { Button } from '@/components/ui/button';
import { ConfirmDialog } from '@/components/ui/confirm-dialog';
import { isApiError } from '@/lib/api-client';
import { RoleBadge } from '@/components/ui/role-badge';
import { useResendInvitation } from '../api/resend-invitation';
import { useRevokeInvitation } from '../api/revoke-invitation';

function errorText(error: unknown, fallback: string): string {
  return isApiError(error) ? error.message : fallback;
}

/** One open invitation: to whom, as what, when sent, until when; resend or revoke. */
export function InvitationRow({
  buildId,
  invitation,
}: {
  buildId: string;
  invitation: Invitation;
}) {
  const resend = useResendInvitation();
  const revoke = useRevokeInvitation();
  const [confirming, setConfirming] = useState(false);
  const { email } = invitation;
  const expired = invitation.status === 'expired';

  const sentLine =
    `Sent ${formatTimestampDate(invitation.lastSentAt)}` +
    (invitation.sendCount > 1 ? ` (${invitation.sendCount} times)` : '') +
    (invitation.invitedBy ? ` by ${invitation.invitedBy}` : '');

  return (
    <li className="flex flex-col gap-2 py-3 first:pt-0 last:pb-0">
      <div className="flex flex-wrap items-center gap-x-3 gap-y-2">
        <div className="min-w-0 flex-1 basis-52">
          <p className="flex flex-wrap items-center gap-x-2 gap-y-1">
            <span className="font-semibold break-words text-ink">{email}</span>
            <RoleBadge role={invitation.role} />
          </p>
          <p className="text-sm text-muted">{sentLine}</p>
          {expired ? (
            <p className="mt-0.5 flex flex-wrap items-center gap-x-2 text-sm text-ink-2">
              <Badge tone="over">Expired</Badge>
              <span>Resend to give them a new link.</span>
            </p>
          ) : (
            <p className="text-sm text-muted">
              Link works until {formatTimestampDate(invitation.expiresAt)}
            </p>
          )}
        </div>
        <div className="flex w-full gap-2 sm:w-auto">
          <Button
            variant={expired ? 'primary' : 'secondary'}
            size="sm"
            className="flex-1 sm:flex-none"
            pending={resend.isPending}
            aria-label={`Resend the invitation to ${email}`}
            onClick={() => {
              revoke.reset();
              resend.mutate({ buildId, invitationId: invitation.id });
            }}
          >
            Resend
          </Button>
          <Button
            variant="ghost"
            size="sm"
            className="flex-1 text-over sm:flex-none"
            aria-label={`Revoke the invitation to ${email}`}
            onClick={() => {
              resend.reset();
              revoke.reset();
              setConfirming(true);
            }}
          >
            Revoke
          </Button>
        </div>
      </div>

      {resend.isSuccess && (
        <Alert tone="ok">Sent again. The link in the earlier mail no longer works.</Alert>
      )}
      {resend.isError && (
        <Alert tone="error">{errorText(resend.error, 'Could not resend it. Try again.')}</Alert>
      )}
      {revoke.isError && !confirming && (
        <Alert tone="error">{errorText(revoke.error, 'Could not revoke it. Try again.')}</Alert>
      )}

      <ConfirmDialog
        open={confirming}
        title="Revoke this invitation?"
        confirmLabel="Yes, revoke"
        pending={revoke.isPending}
        onClose={() => setConfirming(false)}
        onConfirm={() =>
          revoke.mutate(
            { buildId, invitationId: invitation.id },
            { onSettled: () => setConfirming(false) },
          )
        }
      >
        The link sent to <span className="font-semibold break-words">{email}</span> stops working.
        You can invite them again later.
      </ConfirmDialog>
    </li>
  );
}
