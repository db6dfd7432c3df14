import { useMutation } from '@tanstack/react-query';
import type { SignInInput, User } from '@shared/schemas/auth';
import { api } from '@/lib/api-client';
import { useStartSession } from '@/lib/auth';

export async function signIn(input: SignInInput): Promise<User> {
  const data = await api.post<{ user: User }>('/api/auth/sign-in', input, {
    expectUnauthorized: true,
  });
  return data.user;
}

export const useSignIn = () => {
  const startSession = useStartSession();
  return useMutation({ mutationFn: signIn, onSuccess: startSession });
};
