import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { Role } from '@shared/permissions';
import type { User } from '@shared/schemas/auth';
import type { AcceptInvitationInput } from '@shared/schemas/invitations';
import { api } from '@/lib/api-client';
import { useStartSession } from '@/lib/auth';
import { getBuildsQueryOptions } from '@/features/builds/api/get-builds';

export type AcceptInvitationResult = {
  user: User;
  build: { id: string; name: string };
  role: Role;
  /** False when the person was already on the build: their role stays as it was. */
  joined: boolean;
  /** True when the invitation created the account; the server has signed it in. */
  accountCreated: boolean;
};

/** Signed in: an empty body. Signed out: a name and a password create the invited account. */
export async function acceptInvitation({
  token,
  input,
}: {
  token: string;
  input: AcceptInvitationInput;
}): Promise<AcceptInvitationResult> {
  return api.post<AcceptInvitationResult>(
    `/api/invitations/${encodeURIComponent(token)}/accept`,
    input,
  );
}

export const useAcceptInvitation = () => {
  const queryClient = useQueryClient();
  const startSession = useStartSession();
  return useMutation({
    mutationFn: acceptInvitation,
    onSuccess: async (result) => {
      if (result.accountCreated) {
        startSession(result.user);
        return;
      }
      // Same user, one more build: the builds list is out of date.
      await queryClient.invalidateQueries({
        queryKey: getBuildsQueryOptions().queryKey,
        exact: true,
      });
    },
  });
};
