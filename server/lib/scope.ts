/**
 * The caller and the build a request is about, as services receive them, and
 * the small route helper that builds them so a route stays one line.
 */
import type { Request, RequestHandler, Response } from 'express';
import type { Knex } from 'knex';
import type { Role } from '@shared/permissions';
import { idSchema } from '@shared/schemas/common';
import { NotFoundError } from './errors';

/** Who is asking, with their role on the build in the path. */
export type Caller = { userId: string; role: Role };

/** A build-scoped request: the database, the build and the caller. */
export type BuildScope = { knex: Knex; buildId: string; caller: Caller };

export function callerOf(req: Request): Caller {
  return { userId: req.user!.id, role: req.membership!.role };
}

export function scopeOf(req: Request, knex: Knex): BuildScope {
  return { knex, buildId: req.membership!.buildId, caller: callerOf(req) };
}

/** An id from the path; anything that is not a UUID is a thing that does not exist. */
export function parseId(raw: unknown, what: string): string {
  const parsed = idSchema.safeParse(raw);
  if (!parsed.success) throw new NotFoundError(`${what} not found`);
  return parsed.data;
}

/** A path parameter as a string (Express 5 types them loosely). */
export const param = (req: Request, name: string) => String(req.params[name]);

/**
 * A build-scoped JSON route: runs `fn` with the scope and answers its result
 * with `status`; a result of undefined answers 204.
 */
export function scoped(
  knex: Knex,
  fn: (scope: BuildScope, req: Request, res: Response) => Promise<unknown>,
  status = 200,
): RequestHandler {
  return async (req, res) => {
    const body = await fn(scopeOf(req, knex), req, res);
    if (res.headersSent) return;
    if (body === undefined) res.status(204).end();
    else res.status(status).json(body);
  };
}
