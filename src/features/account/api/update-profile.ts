import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { UpdateProfileInput } from '@shared/schemas/account';
import type { User } from '@shared/schemas/auth';
import { api } from '@/lib/api-client';
import { getMeQueryOptions } from '@/lib/me';

export async function updateProfile(input: UpdateProfileInput): Promise<User> {
  const data = await api.patch<{ user: User }>('/api/me', input);
  return data.user;
}

export const useUpdateProfile = () => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateProfile,
    // The header shows the name: it changes at once. Members' lists show it on their next load.
    onSuccess: (user) => queryClient.setQueryData(getMeQueryOptions().queryKey, user),
  });
};
