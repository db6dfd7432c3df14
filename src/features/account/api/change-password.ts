import { useMutation } from '@tanstack/react-query';
import type { ChangePasswordInput } from '@shared/schemas/account';
import type { User } from '@shared/schemas/auth';
import { apiRequest } from '@/lib/api-client';

/** Every other session of the account ends; this browser carries on in a new one. */
export async function changePassword(input: ChangePasswordInput): Promise<User> {
  const data = await apiRequest<{ user: User }>('/api/me/password', { method: 'PUT', body: input });
  return data.user;
}

export const useChangePassword = () => useMutation({ mutationFn: changePassword });
