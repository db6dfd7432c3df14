import { useMutation } from '@tanstack/react-query';
import type { ChangeEmailInput } from '@shared/schemas/account';
import { api } from '@/lib/api-client';

/** Mails a link to the new address; the address changes when it is followed. */
export async function changeEmail(input: ChangeEmailInput): Promise<{ message: string }> {
  return api.post<{ message: string }>('/api/me/email', input);
}

export const useChangeEmail = () => useMutation({ mutationFn: changeEmail });
