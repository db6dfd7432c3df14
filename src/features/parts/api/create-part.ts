import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { CreatePartInput, Part } from '@shared/schemas/parts';
import { api } from '@/lib/api-client';
import { invalidateLedger } from './invalidate';

export async function createPart({
  buildId,
  input,
}: {
  buildId: string;
  input: CreatePartInput;
}): Promise<Part> {
  const data = await api.post<{ part: Part }>(
    `/api/builds/${encodeURIComponent(buildId)}/parts`,
    input,
  );
  return data.part;
}

export const useCreatePart = () => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createPart,
    onSuccess: (_part, { buildId }) => invalidateLedger(queryClient, buildId),
  });
};
