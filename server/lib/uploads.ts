/**
 * Multipart bodies through multer, with every way a body can be broken — no
 * boundary, cut off, garbage part headers, too large — answered as a 400 that
 * says so, never a 500. Errors of the server's own disk stay 500s.
 */
import type { RequestHandler } from 'express';
import { MulterError } from 'multer';
import { AppError } from './errors';

const serverSide = new Set(['ENOSPC', 'EACCES', 'EMFILE', 'EIO', 'EROFS']);

export function receiveUpload(
  upload: RequestHandler,
  describe: (err: MulterError) => {
    code: string;
    message: string;
    fields?: Record<string, string>;
  } = (err) => ({
    code: err.code === 'LIMIT_FILE_SIZE' ? 'file_too_large' : 'bad_upload',
    message:
      err.code === 'LIMIT_FILE_SIZE'
        ? 'The file is too large'
        : `The upload was refused: ${err.message}`,
  }),
): RequestHandler {
  return (req, res, next) => {
    upload(req, res, (err: unknown) => {
      if (!err) return next();
      if (err instanceof MulterError) {
        const d = describe(err);
        return next(new AppError(400, d.code, d.message, d.fields));
      }
      const code = (err as { code?: string }).code;
      if (code && serverSide.has(code)) return next(err);
      next(
        new AppError(
          400,
          'bad_upload',
          'The upload could not be read: send it as multipart/form-data with its file in one piece',
        ),
      );
    });
  };
}
