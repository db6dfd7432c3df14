import type { RequestHandler } from 'express';
import type { z } from 'zod';
import { nulMessage } from '@shared/schemas/common';
import { ValidationError } from '@server/lib/errors';

/** The path of the first string (or key) holding U+0000, which PostgreSQL cannot store. */
export function findNul(value: unknown, path: string[] = []): string | null {
  if (typeof value === 'string') return value.includes('\u0000') ? path.join('.') || '_' : null;
  if (Array.isArray(value)) {
    for (const [i, v] of value.entries()) {
      const found = findNul(v, [...path, String(i)]);
      if (found) return found;
    }
    return null;
  }
  if (value && typeof value === 'object') {
    for (const [k, v] of Object.entries(value)) {
      if (k.includes('\u0000')) return [...path, k.replaceAll('\u0000', '')].join('.') || '_';
      const found = findNul(v, [...path, k]);
      if (found) return found;
    }
  }
  return null;
}

/** Refuses a body with a NUL anywhere, naming the field, before any schema or query sees it. */
export function assertNoNul(body: unknown) {
  const field = findNul(body);
  if (field) {
    throw new ValidationError('Some fields need attention', { [field]: nulMessage });
  }
}

/** Parses the body with a shared zod schema; a failure reaches the error handler as a 400. */
export function validate(schemas: { body?: z.ZodType }): RequestHandler {
  return (req, _res, next) => {
    assertNoNul(req.body);
    if (schemas.body) req.body = schemas.body.parse(req.body ?? {});
    next();
  };
}
