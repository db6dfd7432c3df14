import { useMutation } from '@tanstack/react-query';
import type { RequestPasswordResetInput } from '@shared/schemas/password-reset';
import { api } from '@/lib/api-client';

/** Always answers the same message, whether or not an account uses the address. */
export async function requestPasswordReset(input: RequestPasswordResetInput): Promise<string> {
  const data = await api.post<{ message: string }>('/api/auth/password-reset', input);
  return data.message;
}

export const useRequestPasswordReset = () => useMutation({ mutationFn: requestPasswordReset });
