import { formatIsoDate, formatMoney } from '@shared/format';

/**
 * The shared formatters build a new Intl formatter on every call, which is fine for one
 * figure and slow for a ledger of a thousand rows re-rendered on every sort. The same
 * amount or date always formats the same, so results are remembered (up to a bound).
 */
const limit = 20_000;
const money = new Map<string, string>();
const dates = new Map<string, string>();

function remember(cache: Map<string, string>, key: string, make: () => string): string {
  let value = cache.get(key);
  if (value === undefined) {
    if (cache.size >= limit) cache.clear();
    value = make();
    cache.set(key, value);
  }
  return value;
}

export function cachedMoney(cents: number, currency: string): string {
  return remember(money, `${currency}:${cents}`, () => formatMoney(cents, currency));
}

export function cachedDate(isoDate: string): string {
  return remember(dates, isoDate, () => formatIsoDate(isoDate));
}
