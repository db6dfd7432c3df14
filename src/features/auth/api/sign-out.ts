import { useMutation } from '@tanstack/react-query';
import { api, isApiError } from '@/lib/api-client';
import { useEndSession } from '@/lib/auth';

export async function signOut(): Promise<void> {
  try {
    await api.post<void>('/api/auth/sign-out', undefined, { expectUnauthorized: true });
  } catch (error) {
    // Already signed out (the session expired): the outcome the user asked for.
    if (isApiError(error) && error.status === 401) return;
    throw error;
  }
}

/** The sign-out's mutation key: the status line reads a failed sign-out by it. */
export const signOutKey = ['sign-out'] as const;

export const useSignOut = () => {
  const endSession = useEndSession();
  return useMutation({ mutationKey: signOutKey, mutationFn: signOut, onSuccess: endSession });
};
