import { ApiError } from './api-client';

/**
 * The one client for multipart uploads (a CSV to import, an attachment): the kind of call
 * that cannot go through the JSON client. Photos keep their own upload, which reports
 * progress as it sends.
 */

/** One CSV row the server refused: its row number and why, per column or field. */
export type RowError = { row: number; fields: Record<string, string> };

/** An upload the server refused; `rows` is set when rows of a CSV need fixing. */
export class UploadError extends ApiError {
  readonly rows: RowError[];

  constructor(
    status: number,
    code: string,
    message: string,
    rows: RowError[] = [],
    fields?: Record<string, string>,
  ) {
    super(status, code, message, fields);
    this.name = 'UploadError';
    this.rows = rows;
  }
}

const isStringRecord = (value: unknown): value is Record<string, string> =>
  typeof value === 'object' &&
  value !== null &&
  Object.values(value).every((v) => typeof v === 'string');

/** The API's error shape with its optional rows, checked by hand so zod need not load. */
function readErrorBody(
  body: unknown,
): { code: string; message: string; fields?: Record<string, string>; rows?: RowError[] } | null {
  const error = (body as { error?: unknown } | null)?.error as Record<string, unknown> | undefined;
  if (!error || typeof error.code !== 'string' || typeof error.message !== 'string') return null;
  if (error.fields !== undefined && !isStringRecord(error.fields)) return null;
  const rows = error.rows;
  if (
    rows !== undefined &&
    !(
      Array.isArray(rows) &&
      rows.every(
        (r: { row?: unknown; fields?: unknown }) =>
          typeof r?.row === 'number' && isStringRecord(r.fields),
      )
    )
  ) {
    return null;
  }
  return {
    code: error.code,
    message: error.message,
    fields: error.fields,
    rows: rows as RowError[] | undefined,
  };
}

/** Sends a multipart body (a file with any fields) and reads the JSON answer. */
export async function uploadFile<T>(
  method: 'POST' | 'PUT',
  url: string,
  body: FormData,
): Promise<T> {
  let response: Response;
  try {
    response = await fetch(url, {
      method,
      body,
      credentials: 'same-origin',
      headers: { Accept: 'application/json' },
    });
  } catch {
    throw new UploadError(
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
  if (response.ok) return json as T;
  const error = readErrorBody(json);
  if (error)
    throw new UploadError(response.status, error.code, error.message, error.rows, error.fields);
  throw new UploadError(
    response.status,
    `http_${response.status}`,
    response.status === 413 ? 'The file is too large.' : `The upload failed (${response.status}).`,
  );
}
