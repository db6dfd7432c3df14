import type { RequestHandler } from 'express';
import { stripMoney } from '@server/lib/money-filter';

/**
 * Wraps res.json so that when an access check has set res.locals.hideMoney, the
 * body loses its `…Cents` keys before it is serialised.
 */
export const moneyFilter: RequestHandler = (_req, res, next) => {
  const json = res.json.bind(res);
  res.json = (body: unknown) =>
    json(
      res.locals.hideMoney
        ? stripMoney(body, res.locals.moneyAllow as Set<string> | undefined)
        : body,
    );
  next();
};
