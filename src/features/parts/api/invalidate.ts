import type { QueryClient } from '@tanstack/react-query';
import type { Part } from '@shared/schemas/parts';
import { getBudgetQueryOptions } from '@/features/budget/api/get-budget';
import { getPartsQueryOptions } from './get-parts';

/** Puts one changed part into the cached ledger at once, so the row does not wait for a refetch. */
export function replaceCachedPart(queryClient: QueryClient, buildId: string, part: Part) {
  queryClient.setQueryData(getPartsQueryOptions(buildId).queryKey, (parts) =>
    parts?.map((p) => (p.id === part.id ? part : p)),
  );
}

/** Any change to a part changes the ledger and the budget built from it. */
export async function invalidateLedger(queryClient: QueryClient, buildId: string) {
  await Promise.all([
    queryClient.invalidateQueries({ queryKey: getPartsQueryOptions(buildId).queryKey }),
    queryClient.invalidateQueries({ queryKey: getBudgetQueryOptions(buildId).queryKey }),
  ]);
}
