import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api, isApiError } from '@/lib/api-client';
import { getInvitationsQueryOptions } from './get-invitations';

/** Withdraws an invitation: its link stops working. */
export async function revokeInvitation({
  buildId,
  invitationId,
}: {
  buildId: string;
  invitationId: string;
}): Promise<void> {
  try {
    await api.delete(
      `/api/builds/${encodeURIComponent(buildId)}/invitations/${encodeURIComponent(invitationId)}`,
    );
  } catch (error) {
    // Already accepted or revoked (in another tab): it is off the list either way.
    if (isApiError(error) && error.status === 404) return;
    throw error;
  }
}

export const useRevokeInvitation = () => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: revokeInvitation,
    onSuccess: (_data, { buildId }) =>
      queryClient.invalidateQueries({ queryKey: getInvitationsQueryOptions(buildId).queryKey }),
  });
};
