import { useMutation } from '@tanstack/react-query';
import type { User } from '@shared/schemas/auth';
import type { CompletePasswordResetInput } from '@shared/schemas/password-reset';
import { api } from '@/lib/api-client';
import { useStartSession } from '@/lib/auth';

/** Sets the new password; the server ends every other session and signs this browser in. */
export async function completePasswordReset({
  token,
  input,
}: {
  token: string;
  input: CompletePasswordResetInput;
}): Promise<User> {
  const data = await api.post<{ user: User }>(
    `/api/auth/password-reset/${encodeURIComponent(token)}`,
    input,
  );
  return data.user;
}

export const useCompletePasswordReset = () => {
  const startSession = useStartSession();
  return useMutation({ mutationFn: completePasswordReset, onSuccess: startSession });
};
