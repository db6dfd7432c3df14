import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { UpdateWrenchInput, Wrench } from '@shared/schemas/wrenches';
import { api } from '@/lib/api-client';
import { getWrenchesQueryOptions } from './get-wrenches';

export async function updateWrench({
  wrenchId,
  input,
}: {
  wrenchId: string;
  input: UpdateWrenchInput;
}): Promise<Wrench> {
  const data = await api.patch<{ wrench: Wrench }>(
    `/api/me/wrenches/${encodeURIComponent(wrenchId)}`,
    input,
  );
  return data.wrench;
}

export const useUpdateWrench = () => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateWrench,
    onSuccess: () =>
      queryClient.invalidateQueries({ queryKey: getWrenchesQueryOptions().queryKey }),
  });
};
