import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';

export type PasswordResetLink = { email: string; expiresAt: string };

/**
 * Whether a reset link can still be used, and for which address. A dead link answers 404
 * with the reason as its code (passwordResetErrorCodes).
 */
export async function getPasswordReset(
  token: string,
  signal?: AbortSignal,
): Promise<PasswordResetLink> {
  const data = await api.get<{ reset: PasswordResetLink }>(
    `/api/auth/password-reset/${encodeURIComponent(token)}`,
    { signal },
  );
  return data.reset;
}

export const getPasswordResetQueryOptions = (token: string) =>
  queryOptions({
    queryKey: ['password-resets', token] as const,
    queryFn: ({ signal }) => getPasswordReset(token, signal),
    // Coming back to the tab should not re-check a link the form is about to use.
    refetchOnWindowFocus: false,
  });

export const usePasswordReset = (token: string) => useQuery(getPasswordResetQueryOptions(token));
