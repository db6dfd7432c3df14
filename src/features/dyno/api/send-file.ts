import { z } from 'zod';
import { ApiError } from '../../../lib/api-client';

/** One CSV row the server refused: its data row (1 = first under the header) and why, per column. */
export type RowError = { row: number; fields: Record<string, string> };

/** A file upload the server refused; `rows` is set when rows of a CSV need fixing. */
export class FileUploadError extends ApiError {
  readonly rows: RowError[];

  constructor(
    status: number,
    code: string,
    message: string,
    rows: RowError[] = [],
    fields?: Record<string, string>,
  ) {
    super(status, code, message, fields);
    this.name = 'FileUploadError';
    this.rows = rows;
  }
}

const errorSchema = z.object({
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
 * Sends a multipart body (a CSV or an attachment, with any fields) and reads the JSON answer.
 * The one kind of call that cannot go through the JSON client.
 */
export async function sendFile<T>(method: 'POST' | 'PUT', url: string, body: FormData): Promise<T> {
  let response: Response;
  try {
    response = await fetch(url, {
      method,
      body,
      credentials: 'same-origin',
      headers: { Accept: 'application/json' },
    });
  } catch {
    throw new FileUploadError(
      0,
      'network',
      'Could not reach Headroom. Check your connection and try again.',
    );
  }
  let json: unknown = null;
  try {
    json = await response.json();
  } catch {
    // Not our JSON (a proxy page): handled below.
  }
  if (response.ok) return json as T;
  const parsed = errorSchema.safeParse(json);
  if (parsed.success) {
    const { code, message, rows, fields } = parsed.data.error;
    throw new FileUploadError(response.status, code, message, rows, fields);
  }
  throw new FileUploadError(
    response.status,
    `http_${response.status}`,
    response.status === 413 ? 'The file is too large.' : `The upload failed (${response.status}).`,
  );
}
