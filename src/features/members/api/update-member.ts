import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { Member, UpdateMemberInput } from '@shared/schemas/builds';
import { api } from '@/lib/api-client';
import { invalidateMembership } from './invalidate';

export async function updateMember({
  buildId,
  userId,
  input,
}: {
  buildId: string;
  userId: string;
  input: UpdateMemberInput;
}): Promise<Member> {
  const data = await api.patch<{ member: Member }>(
    `/api/builds/${encodeURIComponent(buildId)}/members/${encodeURIComponent(userId)}`,
    input,
  );
  return data.member;
}

export const useUpdateMember = () => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateMember,
    onSuccess: (_member, { buildId }) => invalidateMembership(queryClient, buildId),
  });
};
