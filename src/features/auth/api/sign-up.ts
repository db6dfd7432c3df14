import { useMutation } from '@tanstack/react-query';
import type { SignUpInput, User } from '@shared/schemas/auth';
import { api } from '@/lib/api-client';
import { useStartSession } from '@/lib/auth';

export async function signUp(input: SignUpInput): Promise<User> {
  const data = await api.post<{ user: User }>('/api/auth/sign-up', input);
  return data.user;
}

export const useSignUp = () => {
  const startSession = useStartSession();
  return useMutation({ mutationFn: signUp, onSuccess: startSession });
};
