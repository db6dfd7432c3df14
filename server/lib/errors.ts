/** Typed errors thrown by services; the error handler turns them into the JSON contract. */
import type { ZodError } from 'zod';

export class AppError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly fields?: Record<string, string>,
  ) {
    super(message);
  }
}

export class ValidationError extends AppError {
  constructor(message: string, fields?: Record<string, string>) {
    super(400, 'invalid_input', message, fields);
  }
}

export class UnauthorizedError extends AppError {
  constructor(message = 'Sign in to continue', code = 'unauthorized') {
    super(401, code, message);
  }
}

export class ForbiddenError extends AppError {
  constructor(message = 'Your role on this build does not allow that') {
    super(403, 'forbidden', message);
  }
}

export class NotFoundError extends AppError {
  constructor(message = 'Not found') {
    super(404, 'not_found', message);
  }
}

export class ConflictError extends AppError {
  constructor(code: string, message: string, fields?: Record<string, string>) {
    super(409, code, message, fields);
  }
}

/**
 * zod issues → { field.path: first message }; unknown keys are named one by one.
 * The object has no prototype, so a key named `__proto__` becomes a field like
 * any other instead of silently replacing the object's prototype.
 */
export function fieldsFromZod(err: ZodError): Record<string, string> {
  const fields: Record<string, string> = Object.create(null);
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
