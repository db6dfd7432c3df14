import { queryOptions, useQuery } from '@tanstack/react-query';
import type { InvitationPreview } from '@shared/schemas/invitations';
import { api } from '@/lib/api-client';

/**
 * What an invitation link offers: the build, the role, who invited. A link that can no longer
 * be used answers 404 with the reason as its code (invitationErrorCodes).
 */
export async function getInvitationLink(
  token: string,
  signal?: AbortSignal,
): Promise<InvitationPreview> {
  const data = await api.get<{ invitation: InvitationPreview }>(
    `/api/invitations/${encodeURIComponent(token)}`,
    { signal },
  );
  return data.invitation;
}

export const getInvitationLinkQueryOptions = (token: string) =>
  queryOptions({
    queryKey: ['invitation-links', token] as const,
    queryFn: ({ signal }) => getInvitationLink(token, signal),
  });

export const useInvitationLink = (token: string) => useQuery(getInvitationLinkQueryOptions(token));
