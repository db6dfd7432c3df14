// Migrates the test database once, before any test file runs, so parallel files
// never race for knex's migration lock. npm test starts the throwaway cluster.
import knexFactory from 'knex';
import { knexConfig } from '@db/knexfile';

export default async function setup() {
  const url = process.env.DATABASE_URL;
  if (!url) return; // unit-only runs need no database
  const knex = knexFactory(knexConfig(url));
  try {
    await knex.migrate.latest();
  } finally {
    await knex.destroy();
  }
}
