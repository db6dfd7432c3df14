import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { Part, UpdatePartInput } from '@shared/schemas/parts';
import { api } from '@/lib/api-client';
import { invalidateLedger, replaceCachedPart } from './invalidate';

export async function updatePart({
  buildId,
  partId,
  input,
}: {
  buildId: string;
  partId: string;
  input: UpdatePartInput;
}): Promise<Part> {
  const data = await api.patch<{ part: Part }>(
    `/api/builds/${encodeURIComponent(buildId)}/parts/${encodeURIComponent(partId)}`,
    input,
  );
  return data.part;
}

export const useUpdatePart = () => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updatePart,
    onSuccess: async (part, { buildId }) => {
      replaceCachedPart(queryClient, buildId, part);
      await invalidateLedger(queryClient, buildId);
    },
  });
};
