import { queryOptions, useQuery } from '@tanstack/react-query';
import type { Invitation } from '@shared/schemas/invitations';
import { api } from '@/lib/api-client';

/** The build's open invitations (not yet accepted or revoked), newest first; expired ones too. */
export async function getInvitations(buildId: string, signal?: AbortSignal): Promise<Invitation[]> {
  const data = await api.get<{ invitations: Invitation[] }>(
    `/api/builds/${encodeURIComponent(buildId)}/invitations`,
    { signal },
  );
  return data.invitations;
}

export const getInvitationsQueryOptions = (buildId: string) =>
  queryOptions({
    queryKey: ['builds', buildId, 'invitations'] as const,
    queryFn: ({ signal }) => getInvitations(buildId, signal),
  });

export const useInvitations = (buildId: string, { enabled = true } = {}) =>
  useQuery({ ...getInvitationsQueryOptions(buildId), enabled });
