import type { ErrorRequestHandler, RequestHandler } from 'express';
import { MulterError } from 'multer';
import { ZodError } from 'zod';
import { AppError } from '../lib/errors';
import type { Logger } from '../lib/logger';

/** zod issues → { field.path: first message }; unknown keys are named one by one. */
export function fieldsFromZod(err: ZodError): Record<string, string> {
  const fields: Record<string, string> = {};
  for (const issue of err.issues) {
    if (issue.code === 'unrecognized_keys') {
      for (const key of issue.keys) fields[[...issue.path, key].join('.')] ??= 'Unknown field';
      continue;
    }
    const path = issue.path.join('.') || '_';
    fields[path] ??= issue.message;
  }
  return fields;
}

export const notFoundApi: RequestHandler = (req, res) => {
  res
    .status(404)
    .json({ error: { code: 'not_found', message: `No API route ${req.method} ${req.path}` } });
};

export function errorHandler(logger: Logger): ErrorRequestHandler {
  return (err, req, res, _next) => {
    if (res.headersSent) return;
    if (err instanceof AppError) {
      res.status(err.status).json({
        error: {
          code: err.code,
          message: err.message,
          ...(err.fields ? { fields: err.fields } : {}),
          ...('rows' in err ? { rows: err.rows } : {}),
        },
      });
      return;
    }
    if (err instanceof ZodError) {
      res.status(400).json({
        error: {
          code: 'invalid_input',
          message: 'Some fields need attention',
          fields: fieldsFromZod(err),
        },
      });
      return;
    }
    if (err instanceof MulterError) {
      const message =
        err.code === 'LIMIT_FILE_SIZE'
          ? 'The file is too large'
          : `The upload was refused: ${err.message}`;
      res.status(400).json({
        error: {
          code: err.code === 'LIMIT_FILE_SIZE' ? 'file_too_large' : 'bad_upload',
          message,
        },
      });
      return;
    }
    // body-parser errors carry a type and a status of their own.
    const type = (err as { type?: string }).type;
    if (type === 'entity.parse.failed') {
      res
        .status(400)
        .json({ error: { code: 'malformed_json', message: 'The request body is not valid JSON' } });
      return;
    }
    if (type === 'entity.too.large') {
      res
        .status(413)
        .json({ error: { code: 'too_large', message: 'The request body is too large' } });
      return;
    }
    if (type === 'charset.unsupported' || type === 'encoding.unsupported') {
      res
        .status(415)
        .json({ error: { code: 'unsupported_encoding', message: 'Send the body as UTF-8 JSON' } });
      return;
    }
    logger.error({ err, method: req.method, url: req.originalUrl }, 'unhandled error');
    res.status(500).json({ error: { code: 'internal', message: 'Something went wrong' } });
  };
}
