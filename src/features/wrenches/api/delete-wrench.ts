import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { getWrenchesQueryOptions } from './get-wrenches';

/** Readings taken with the wrench keep its name and calibration. */
export async function deleteWrench(wrenchId: string): Promise<void> {
  await api.delete<void>(`/api/me/wrenches/${encodeURIComponent(wrenchId)}`);
}

export const useDeleteWrench = () => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: deleteWrench,
    onSuccess: () =>
      queryClient.invalidateQueries({ queryKey: getWrenchesQueryOptions().queryKey }),
  });
};
