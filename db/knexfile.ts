import type { Knex } from 'knex';
import { migrationSource } from './migrations/index';

/** Knex settings; DATABASE_URL comes from the start and test scripts. */
export function knexConfig(connectionString: string): Knex.Config {
  return {
    client: 'pg',
    connection: connectionString,
    pool: { min: 0, max: 10 },
    migrations: { migrationSource, tableName: 'knex_migrations' },
  };
}

export default knexConfig(
  process.env.DATABASE_URL ?? 'postgres://headroom@127.0.0.1:54329/headroom',
);
