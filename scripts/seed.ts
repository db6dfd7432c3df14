// Seeds the demo build when the database has no users yet; never touches real data.
import knexFactory from 'knex';
import { knexConfig } from '../db/knexfile';
import { seedDemo } from '../db/seeds/demo';

const url = process.env.DATABASE_URL;
if (!url) {
  console.error('DATABASE_URL is not set');
  process.exit(1);
}
const knex = knexFactory(knexConfig(url));
try {
  const { count } = (await knex('users').count<{ count: string }[]>('* as count'))[0];
  if (Number(count) > 0 && !process.argv.includes('--force')) {
    console.log('database already has accounts: demo data not added');
  } else {
    await knex.transaction((trx) => seedDemo(trx));
    console.log('demo data added');
  }
} finally {
  await knex.destroy();
}
