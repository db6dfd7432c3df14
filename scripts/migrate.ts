// Brings the database in DATABASE_URL to the latest migration.
import knexFactory from 'knex';
import { knexConfig } from '@db/knexfile';

const url = process.env.DATABASE_URL;
if (!url) {
  console.error('DATABASE_URL is not set');
  process.exit(1);
}
const knex = knexFactory(knexConfig(url));
try {
  const [, applied] = await knex.migrate.latest();
  console.log(applied.length ? `migrated: ${applied.join(', ')}` : 'database is up to date');
} finally {
  await knex.destroy();
}
