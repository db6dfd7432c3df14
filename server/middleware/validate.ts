import type { RequestHandler } from 'express';
import type { z } from 'zod';

/** Parses the body with a shared zod schema; a failure reaches the error handler as a 400. */
export function validate(schemas: { body?: z.ZodType }): RequestHandler {
  return (req, _res, next) => {
    if (schemas.body) req.body = schemas.body.parse(req.body ?? {});
    next();
  };
}
