import type { ErrorRequestHandler, RequestHandler } from 'express';
import { MulterError } from 'multer';
import { ZodError } from 'zod';
import { isDatabaseUnavailable } from '@server/lib/database';
import { AppError, fieldsFromZod } from '@server/lib/errors';
import type { Logger } from '@server/lib/logger';
import { isStorageUnavailable } from '@server/lib/storage';

export const notFoundApi: RequestHandler = (req, res) => {
  res
    .status(404)
    .json({ error: { code: 'not_found', message: `No API route ${req.method} ${req.path}` } });
};

type Answer = { status: number; code: string; message: string };

/** body-parser, raw-body, the router and busboy mark client errors with a type or a status. */
function clientError(err: unknown): Answer | null {
  const e = err as { type?: string; status?: unknown; statusCode?: unknown; message?: unknown };
  switch (e.type) {
    case 'entity.parse.failed':
      return { status: 400, code: 'malformed_json', message: 'The request body is not valid JSON' };
    case 'entity.too.large':
      return { status: 413, code: 'too_large', message: 'The request body is too large' };
    case 'charset.unsupported':
    case 'encoding.unsupported':
      return { status: 415, code: 'unsupported_encoding', message: 'Send the body as UTF-8 JSON' };
  }
  if (err instanceof URIError) {
    return { status: 400, code: 'bad_path', message: 'The address has broken %-encoding' };
  }
  const status = Number(e.status ?? e.statusCode);
  if (Number.isInteger(status) && status >= 400 && status < 500) {
    // A body that says it is compressed but is not, a path that cannot be decoded, …
    return {
      status,
      code: status === 413 ? 'too_large' : 'bad_request',
      message:
        status === 413
          ? 'The request body is too large'
          : 'The request could not be read: check its encoding and body',
    };
  }
  return null;
}

export function errorHandler(logger: Logger): ErrorRequestHandler {
  return (err, req, res, _next) => {
    if (res.headersSent) return;
    const send = (a: Answer, extra: Record<string, unknown> = {}) =>
      res.status(a.status).json({ error: { code: a.code, message: a.message, ...extra } });

    if (err instanceof AppError) {
      send(err, {
        ...(err.fields ? { fields: err.fields } : {}),
        ...('rows' in err ? { rows: err.rows } : {}),
      });
      return;
    }
    if (err instanceof ZodError) {
      send(
        { status: 400, code: 'invalid_input', message: 'Some fields need attention' },
        { fields: fieldsFromZod(err) },
      );
      return;
    }
    if (err instanceof MulterError) {
      const tooLarge = err.code === 'LIMIT_FILE_SIZE';
      send({
        status: 400,
        code: tooLarge ? 'file_too_large' : 'bad_upload',
        message: tooLarge ? 'The file is too large' : `The upload was refused: ${err.message}`,
      });
      return;
    }
    const known = clientError(err);
    if (known) {
      send(known);
      return;
    }
    if (isDatabaseUnavailable(err)) {
      logger.warn({ err: String(err), url: req.originalUrl }, 'database unavailable');
      res.set('Retry-After', '5');
      send({
        status: 503,
        code: 'database_unavailable',
        message:
          'Headroom cannot reach its database just now. Nothing was saved; try again shortly.',
      });
      return;
    }
    if (isStorageUnavailable(err)) {
      logger.warn({ err: String(err), url: req.originalUrl }, 'file store unavailable');
      res.set('Retry-After', '5');
      send({
        status: 503,
        code: 'storage_unavailable',
        message:
          'Headroom cannot reach its file store just now. Nothing was saved; try again shortly.',
      });
      return;
    }
    logger.error({ err, method: req.method, url: req.originalUrl }, 'unhandled error');
    send({ status: 500, code: 'internal', message: 'Something went wrong' });
  };
}
