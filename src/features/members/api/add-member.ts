import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { AddMemberInput, Member } from '../../../../shared/schemas/builds';
import { api } from '../../../lib/api-client';
import { invalidateMembership } from './invalidate';

export async function addMember({
  buildId,
  input,
}: {
  buildId: string;
  input: AddMemberInput;
}): Promise<Member> {
  const data = await api.post<{ member: Member }>(
    `/api/builds/${encodeURIComponent(buildId)}/members`,
    input,
  );
  return data.member;
}

export const useAddMember = () => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: addMember,
    onSuccess: (_member, { buildId }) => invalidateMembership(queryClient, buildId),
  });
};
