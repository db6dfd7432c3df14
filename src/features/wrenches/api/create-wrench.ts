import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { CreateWrenchInput, Wrench } from '@shared/schemas/wrenches';
import { api } from '@/lib/api-client';
import { getWrenchesQueryOptions } from './get-wrenches';

export async function createWrench(input: CreateWrenchInput): Promise<Wrench> {
  const data = await api.post<{ wrench: Wrench }>('/api/me/wrenches', input);
  return data.wrench;
}

export const useCreateWrench = () => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createWrench,
    onSuccess: () =>
      queryClient.invalidateQueries({ queryKey: getWrenchesQueryOptions().queryKey }),
  });
};
