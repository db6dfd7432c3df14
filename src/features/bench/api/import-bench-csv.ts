import { useMutation, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import {
  benchUploadField,
  type BenchImportRowError,
  type BenchSheetAnswer,
} from '../../../../shared/schemas/bench';
import { ApiError } from '../../../lib/api-client';
import { getBenchSheetQueryOptions } from './get-bench-sheet';
import { invalidateBench } from './invalidate';
import { benchSheetUrl } from './paths';

/** An import refused by the server; `rows` names each bad cell by its row and column heading. */
export class BenchImportError extends ApiError {
  readonly rows: BenchImportRowError[];

  constructor(
    status: number,
    code: string,
    message: string,
    rows: BenchImportRowError[] = [],
    fields?: Record<string, string>,
  ) {
    super(status, code, message, fields);
    this.name = 'BenchImportError';
    this.rows = rows;
  }
}

const importErrorSchema = z.object({
  error: z.object({
    code: z.string(),
    message: z.string(),
    fields: z.record(z.string(), z.string()).optional(),
    rows: z
      .array(z.object({ row: z.number(), fields: z.record(z.string(), z.string()) }))
      .optional(),
  }),
});

export type BenchImportAnswer = BenchSheetAnswer & { dryRun: boolean; positions: number[] };

/**
 * Replaces a saved sheet's values from a CSV: one row per injector position, one column per
 * test point. The server checks every cell and saves all of them or none.
 */
export async function importBenchCsv({
  buildId,
  sheetId,
  file,
}: {
  buildId: string;
  sheetId: string;
  file: File;
}): Promise<BenchImportAnswer> {
  const body = new FormData();
  body.append(benchUploadField, file);
  let response: Response;
  try {
    response = await fetch(`${benchSheetUrl(buildId, sheetId)}/import`, {
      method: 'POST',
      body,
      credentials: 'same-origin',
      headers: { Accept: 'application/json' },
    });
  } catch {
    throw new ApiError(0, 'network', 'Could not reach Headroom. Check your connection and retry.');
  }
  let json: unknown = null;
  try {
    json = await response.json();
  } catch {
    // Not our JSON: answered generically below.
  }
  if (response.ok) return json as BenchImportAnswer;
  const parsed = importErrorSchema.safeParse(json);
  if (parsed.success) {
    const { code, message, rows, fields } = parsed.data.error;
    throw new BenchImportError(response.status, code, message, rows, fields);
  }
  throw new ApiError(response.status, `http_${response.status}`, 'The file could not be read.');
}

export const useImportBenchCsv = () => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: importBenchCsv,
    onSuccess: async (answer, { buildId, sheetId }) => {
      const { dryRun: _d, positions: _p, ...sheet } = answer;
      queryClient.setQueryData(getBenchSheetQueryOptions(buildId, sheetId).queryKey, sheet);
      await invalidateBench(queryClient, buildId);
    },
  });
};
