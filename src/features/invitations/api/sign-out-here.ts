import { useMutation, useQueryClient } from '@tanstack/react-query';
import { getMeQueryOptions } from '@/lib/me';
import { signOut } from '@/features/auth/api/sign-out';
import { getInvitationLinkQueryOptions } from './get-invitation-link';

const meKey = getMeQueryOptions().queryKey;
const linkKey = getInvitationLinkQueryOptions('').queryKey[0];

/**
 * Signs out from the invitation page and stays on it, so the person can sign in with the
 * invited address (or create its account) right there. The app's usual sign-out goes to the
 * sign-in page instead and would lose the link.
 */
export const useSignOutHere = () => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: signOut,
    onSuccess: () => {
      queryClient.setQueryData(meKey, null);
      // The previous user's data goes; the invitation itself is public and stays.
      queryClient.removeQueries({
        predicate: (query) => query.queryKey[0] !== meKey[0] && query.queryKey[0] !== linkKey,
      });
    },
  });
};
