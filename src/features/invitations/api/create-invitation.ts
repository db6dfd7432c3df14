import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { CreateInvitationInput, Invitation } from '@shared/schemas/invitations';
import { api } from '@/lib/api-client';
import { getInvitationsQueryOptions } from './get-invitations';

export async function createInvitation({
  buildId,
  input,
}: {
  buildId: string;
  input: CreateInvitationInput;
}): Promise<Invitation> {
  const data = await api.post<{ invitation: Invitation }>(
    `/api/builds/${encodeURIComponent(buildId)}/invitations`,
    input,
  );
  return data.invitation;
}

export const useCreateInvitation = () => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createInvitation,
    onSuccess: (_invitation, { buildId }) =>
      queryClient.invalidateQueries({ queryKey: getInvitationsQueryOptions(buildId).queryKey }),
  });
};
