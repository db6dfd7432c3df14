import { useMutation, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import type { CreatePartInput } from '../../../../shared/schemas/parts';
import { ApiError } from '../../../lib/api-client';
import { invalidateLedger } from './invalidate';

/** One CSV row that failed: its row number in the file (the header is row 1) and why, per field. */
export type ImportRowError = { row: number; fields: Record<string, string> };

/** An import refused by the server; `rows` is set when individual rows need fixing. */
export class ImportError extends ApiError {
  readonly rows: ImportRowError[];

  constructor(
    status: number,
    code: string,
    message: string,
    rows: ImportRowError[] = [],
    fields?: Record<string, string>,
  ) {
    super(status, code, message, fields);
    this.name = 'ImportError';
    this.rows = rows;
  }
}

export type ImportResult = { dryRun: boolean; saved: number; rows: CreatePartInput[] };

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

/**
 * Uploads a CSV of parts. With dryRun the server only checks every row and answers with
 * what it would save; without it, it saves all rows or none.
 * A multipart body, so this is the one call that does not go through the JSON client.
 */
export async function importParts({
  buildId,
  file,
  dryRun,
}: {
  buildId: string;
  file: File;
  dryRun: boolean;
}): Promise<ImportResult> {
  const body = new FormData();
  body.append('file', file);
  const url = `/api/builds/${encodeURIComponent(buildId)}/parts/import${dryRun ? '?dryRun=1' : ''}`;
  let response: Response;
  try {
    response = await fetch(url, {
      method: 'POST',
      body,
      credentials: 'same-origin',
      headers: { Accept: 'application/json' },
    });
  } catch {
    throw new ImportError(
      0,
      'network',
      'Could not reach Headroom. Check your connection and try again.',
    );
  }
  let json: unknown = null;
  try {
    json = await response.json();
  } catch {
    // Not our JSON (a proxy page, an empty body): handled below.
  }
  if (response.ok) return json as ImportResult;
  const parsed = importErrorSchema.safeParse(json);
  if (parsed.success) {
    const { code, message, rows, fields } = parsed.data.error;
    throw new ImportError(response.status, code, message, rows, fields);
  }
  throw new ImportError(
    response.status,
    `http_${response.status}`,
    response.status === 413 ? 'The file is too large' : `The import failed (${response.status}).`,
  );
}

export const useImportParts = () => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: importParts,
    onSuccess: async (result, { buildId }) => {
      if (!result.dryRun) await invalidateLedger(queryClient, buildId);
    },
  });
};
