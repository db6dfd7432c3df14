import { queryOptions, useQuery } from '@tanstack/react-query';
import type { EmailChangePreview } from '@shared/schemas/account';
import { api } from '@/lib/api-client';

/** What a confirmation link is for (404 with a reason when it cannot be used). */
export async function getEmailChange(token: string, signal?: AbortSignal) {
  const data = await api.get<{ change: EmailChangePreview }>(
    `/api/email-changes/${encodeURIComponent(token)}`,
    { signal, expectUnauthorized: true },
  );
  return data.change;
}

export const getEmailChangeQueryOptions = (token: string) =>
  queryOptions({
    queryKey: ['email-changes', token] as const,
    queryFn: ({ signal }) => getEmailChange(token, signal),
    retry: false,
  });

export const useEmailChange = (token: string) => useQuery(getEmailChangeQueryOptions(token));
