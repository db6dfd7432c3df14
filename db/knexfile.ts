import type { Knex } from 'knex';
import { migrationSource } from './migrations/index';

/**
 * Knex settings; DATABASE_URL comes from the start and test scripts. With
 * `timeouts`, a connection attempt and a statement are bounded, so a request
 * fails fast (and the app answers 503) while PostgreSQL is away.
 */
export function knexConfig(
  connectionString: string,
  timeouts?: { connectMs: number; statementMs: number },
): Knex.Config {
  return {
    client: 'pg',
    connection: timeouts
      ? {
          connectionString,
          connectionTimeoutMillis: timeouts.connectMs,
          statement_timeout: timeouts.statementMs,
          query_timeout: timeouts.statementMs + 1_000,
        }
      : connectionString,
    pool: { min: 0, max: 10 },
    acquireConnectionTimeout: timeouts ? timeouts.connectMs + 1_000 : 60_000,
    migrations: { migrationSource, tableName: 'knex_migrations' },
  };
}

export default knexConfig(
  process.env.DATABASE_URL ?? 'postgres://headroom@127.0.0.1:54329/headroom',
);
