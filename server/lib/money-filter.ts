/**
 * Removes every key ending in `Cents` from a JSON body, at any depth. Applied on
 * the server to every response for a role that may not see money, so nothing a
 * page forgets to hide can leak it. `allow` keeps named keys (a shop's own quote).
 */
export function stripMoney(value: unknown, allow: ReadonlySet<string> = new Set()): unknown {
  if (Array.isArray(value)) return value.map((v) => stripMoney(v, allow));
  if (value && typeof value === 'object' && !(value instanceof Date)) {
    const out: Record<string, unknown> = {};
    for (const [k, v] of Object.entries(value)) {
      if (k.endsWith('Cents') && !allow.has(k)) continue;
      out[k] = stripMoney(v, allow);
    }
    return out;
  }
  return value;
}
