import knexFactory, { type Knex } from 'knex';
import pg from 'pg';
import { knexConfig } from '../../db/knexfile';

// bigint (money in cents) and numeric come back from pg as strings; ours fit in a double.
pg.types.setTypeParser(pg.types.builtins.INT8, (v) => Number(v));
pg.types.setTypeParser(pg.types.builtins.NUMERIC, (v) => Number(v));
// A calendar date stays a 'YYYY-MM-DD' string: no time zone may shift it by a day.
pg.types.setTypeParser(pg.types.builtins.DATE, (v) => v);

export type Database = { knex: Knex; pool: pg.Pool; close: () => Promise<void> };

/** One knex instance for the app and one small pg pool for the session library. */
export function createDatabase(connectionString: string): Database {
  const knex = knexFactory(knexConfig(connectionString));
  const pool = new pg.Pool({ connectionString, max: 5 });
  return {
    knex,
    pool,
    close: async () => {
      await Promise.all([knex.destroy(), pool.end()]);
    },
  };
}
