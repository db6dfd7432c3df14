/**
 * Idempotent creates. A request carrying an `Idempotency-Key` header runs in one
 * transaction with the key's row: the write and the key commit together, so a write
 * sent twice (a retry after a lost answer) is stored once and the repeat gets the
 * first answer. The same key with a different request is refused (422). Keys are
 * per user and kept for `idempotencyKeepDays`; older ones are pruned on each keyed write.
 *
 * The write runs with the transaction in place of the database: services open their
 * own transactions on what they are given, which then become savepoints inside this one.
 */
import { createHash } from 'node:crypto';
import type { Request, RequestHandler, Response } from 'express';
import type { Knex } from 'knex';
import {
  idempotencyKeepDays,
  idempotencyKeyHeader,
  idempotencyKeySchema,
} from '@shared/schemas/idempotency';
import { AppError, ValidationError } from './errors';
import * as repo from './idempotency.repository';
import { scopeOf, type BuildScope } from './scope';

/** The key of this request, undefined when it has none; a malformed key is a 400. */
export function idempotencyKeyOf(req: Request): string | undefined {
  const raw = req.get(idempotencyKeyHeader);
  if (raw === undefined) return undefined;
  const parsed = idempotencyKeySchema.safeParse(raw.trim());
  if (!parsed.success) {
    throw new ValidationError('The idempotency key is not valid', {
      [idempotencyKeyHeader]: parsed.error.issues[0].message,
    });
  }
  return parsed.data.toLowerCase();
}

/** What makes two requests the same: method, path and body, plus anything the route adds (uploaded files). */
function requestHash(req: Request, extra: string) {
  const path = req.originalUrl.split('?')[0];
  return createHash('sha256')
    .update(`${req.method} ${path}\n${JSON.stringify(req.body ?? null)}\n${extra}`)
    .digest('hex');
}

/**
 * Runs `write` (with a transaction when the request has a key, else the database) and
 * answers its result with `status`; a repeat of a keyed request answers what the first got.
 */
export async function answerOnce(
  knex: Knex,
  req: Request,
  res: Response,
  status: number,
  write: (db: Knex) => Promise<unknown>,
  extra: () => Promise<string> = async () => '',
) {
  const key = idempotencyKeyOf(req);
  if (!key) {
    res.status(status).json(await write(knex));
    return;
  }
  const userId = req.user!.id;
  const hash = requestHash(req, await extra());
  const answer = await knex.transaction(async (trx) => {
    if (!(await repo.claim(trx, userId, key, hash))) {
      const stored = (await repo.find(trx, userId, key))!;
      if (stored.requestHash !== hash) {
        throw new AppError(
          422,
          'idempotency_key_reused',
          'This idempotency key was already used for a different request; send a new key for a new write',
        );
      }
      return { status: stored.status ?? status, body: stored.body, replayed: true };
    }
    const body = await write(trx);
    await repo.saveAnswer(trx, userId, key, status, body);
    return { status, body, replayed: false };
  });
  // Best effort: a failed prune leaves old keys for the next keyed write to remove.
  await repo.prune(knex, idempotencyKeepDays).catch(() => undefined);
  if (answer.replayed) res.set('Idempotent-Replayed', 'true');
  res.status(answer.status).json(answer.body);
}

/** `scoped()` for a create the offline queue may send twice: the scope's knex is the key's transaction. */
export function idempotentScoped(
  knex: Knex,
  fn: (scope: BuildScope, req: Request) => Promise<unknown>,
  status = 201,
): RequestHandler {
  return (req, res) => answerOnce(knex, req, res, status, (db) => fn(scopeOf(req, db), req));
}
