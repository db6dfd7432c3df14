import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { Invitation } from '@shared/schemas/invitations';
import { api } from '@/lib/api-client';
import { getInvitationsQueryOptions } from './get-invitations';

/** Mails a new link (the old one stops working), valid for another full week. */
export async function resendInvitation({
  buildId,
  invitationId,
}: {
  buildId: string;
  invitationId: string;
}): Promise<Invitation> {
  const data = await api.post<{ invitation: Invitation }>(
    `/api/builds/${encodeURIComponent(buildId)}/invitations/${encodeURIComponent(invitationId)}/resend`,
  );
  return data.invitation;
}

export const useResendInvitation = () => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: resendInvitation,
    onSuccess: (_invitation, { buildId }) =>
      queryClient.invalidateQueries({ queryKey: getInvitationsQueryOptions(buildId).queryKey }),
  });
};
