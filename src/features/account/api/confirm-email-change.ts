import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { User } from '@shared/schemas/auth';
import { api } from '@/lib/api-client';
import { getMeQueryOptions } from '@/lib/me';

export async function confirmEmailChange(token: string): Promise<User> {
  const data = await api.post<{ user: User }>(
    `/api/email-changes/${encodeURIComponent(token)}`,
    {},
    { expectUnauthorized: true },
  );
  return data.user;
}

export const useConfirmEmailChange = () => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: confirmEmailChange,
    // Signed in as that account here: show the new address at once.
    onSuccess: (user) =>
      queryClient.setQueryData(getMeQueryOptions().queryKey, (me: User | null | undefined) =>
        me && me.id === user.id ? user : me,
      ),
  });
};
