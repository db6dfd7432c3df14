import knexFactory, { type Knex } from 'knex';
import pg from 'pg';
import { knexConfig } from '@db/knexfile';

// bigint (money in cents) and numeric come back from pg as strings; ours fit in a double.
pg.types.setTypeParser(pg.types.builtins.INT8, (v) => Number(v));
pg.types.setTypeParser(pg.types.builtins.NUMERIC, (v) => Number(v));
// A calendar date stays a 'YYYY-MM-DD' string: no time zone may shift it by a day.
pg.types.setTypeParser(pg.types.builtins.DATE, (v) => v);

export type Database = {
  knex: Knex;
  pool: pg.Pool;
  /** Resolves when the database answers a trivial query, rejects otherwise. */
  ping: () => Promise<void>;
  close: () => Promise<void>;
};

/**
 * Limits that keep a request from hanging when PostgreSQL is away or stuck: a
 * new connection gives up after connectMs, a statement after statementMs. The
 * app answers 503 meanwhile and serves again once the database is back.
 */
export const databaseTimeouts = { connectMs: 3_000, statementMs: 15_000 };

/** One knex instance for the app and one small pg pool for the session library. */
export function createDatabase(
  connectionString: string,
  opts: { onError?: (err: Error) => void } = {},
): Database {
  // An idle connection that PostgreSQL drops (a restart: 57P01) emits 'error' on
  // its pool; a pool without a listener would take the whole process down.
  const onError = opts.onError ?? (() => undefined);
  const knex = knexFactory(knexConfig(connectionString, databaseTimeouts));
  const pool = new pg.Pool({
    connectionString,
    max: 5,
    connectionTimeoutMillis: databaseTimeouts.connectMs,
    statement_timeout: databaseTimeouts.statementMs,
    query_timeout: databaseTimeouts.statementMs + 1_000,
  });
  pool.on('error', onError);
  return {
    knex,
    pool,
    // On knex's pool, the one most reads use, so a pool run dry shows here as it does to
    // them; but a bare query on the connection, without knex's builder and runner (a sixth
    // of the check's CPU, and monitors poll it). A connection PostgreSQL dropped is marked
    // by knex on its 'error' and refused by the pool at the next acquire.
    ping: async () => {
      const client = knex.client as {
        acquireConnection: () => Promise<pg.Client>;
        releaseConnection: (connection: pg.Client) => Promise<void>;
      };
      const connection = await client.acquireConnection();
      try {
        await connection.query('select 1');
      } finally {
        await client.releaseConnection(connection);
      }
    },
    close: async () => {
      await Promise.all([knex.destroy(), pool.end()]);
    },
  };
}

// PostgreSQL classes 08 (connection exception) and 57P (operator intervention:
// shutdown, crash, cannot connect now), 53300 (too many connections) and
// 57014 (statement timeout): the database, not the request, is the problem.
const unavailableSqlState = /^(08|57P)|^53300$|^57014$/;
const unavailableNodeCodes = new Set([
  'ECONNREFUSED',
  'ECONNRESET',
  'EPIPE',
  'ETIMEDOUT',
  'EHOSTUNREACH',
]);

/** True when an error means PostgreSQL is away or not answering in time. */
export function isDatabaseUnavailable(err: unknown): boolean {
  if (!err || typeof err !== 'object') return false;
  const e = err as { name?: string; code?: unknown; message?: unknown };
  if (e.name === 'KnexTimeoutError') return true;
  if (typeof e.code === 'string') {
    if (unavailableNodeCodes.has(e.code)) return true;
    if (/^[0-9A-Z]{5}$/.test(e.code) && unavailableSqlState.test(e.code)) return true;
  }
  const message = typeof e.message === 'string' ? e.message : '';
  return /Connection terminated|connection timeout|not queryable|Query read timeout/i.test(message);
}
